/** The standing caution shown on every page that shows numbers and on every export (PDF, CSV). */
export const CAUTION_TEXT =
  "Linkwright's numbers aid your own engineering and the designer's data — they do not replace them. Follow the kit or plans designer's instructions, the airworthiness regulations and a qualified inspector; defer to local rules and licensed practice.";

/**
 * The caution in a CSV export: after the data, an empty row, then one cell that starts "Caution." (a spreadsheet
 * shows it under the table; the parts import skips it, isCautionRow). CAUTION_CSV_ROWS is that ending as CSV text.
 */
export const CAUTION_CSV_CELL = `Caution. ${CAUTION_TEXT}`;
export const CAUTION_CSV_ROWS = `\r\n"${CAUTION_CSV_CELL.replace(/"/g, '""')}"\r\n`;
/** A CSV row that is the caution line of an export (its first cell starts "Caution.", every other cell empty). */
export const isCautionRow = (cells: readonly string[]) => /^caution\.\s/i.test(cells[0]?.trim() ?? "") && cells.slice(1).every((c) => !c.trim());
