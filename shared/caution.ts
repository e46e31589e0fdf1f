/** The standing caution shown on every page that shows numbers and on every export (PDF, CSV). */
export const CAUTION_TEXT =
  "Linkwright's numbers aid your own engineering and the designer's data — they do not replace them. Follow the kit or plans designer's instructions, the airworthiness regulations and a qualified inspector; defer to local rules and licensed practice.";
