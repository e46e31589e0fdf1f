/** The card's heading: where the focus goes when a part or joint is opened from the canvas or the list. */
export const CARD_TITLE_ID = "editor-card-title";
