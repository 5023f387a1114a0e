/**
 * Spreadsheet-formula neutralising for every CSV the app writes (server exports and the sweep
 * page's download), as commonly practised against CSV injection: a text cell a spreadsheet would
 * read as a formula (it starts with =, +, - or @, possibly after spaces, or with a tab or a
 * carriage return) gets a leading single quote, which spreadsheets show as text. A cell that is a
 * plain decimal number ("-1.5", "+2", "-3e-5") is left alone: it is a number, not a formula, and
 * must stay one for whoever computes with the file.
 */
export const FORMULA_LIKE = /^(?![+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$)(?:[\t\r]|[ \t\r]*[=+\-@])/;

/** Papa.unparse options: escapeFormulae with the rule above (numbers are never touched). */
export const SAFE_UNPARSE = { escapeFormulae: FORMULA_LIKE } as const;

/** One text cell, neutralised the same way (for text written without papaparse). */
export function safeCell(text: string): string {
  return FORMULA_LIKE.test(text) ? `'${text}` : text;
}

/**
 * The text of a "# ..." comment line holding user text (a project name). It is written unquoted,
 * so that readers skipping "#" lines still do; so line breaks become spaces (the text cannot
 * start a row of its own) and every piece a spreadsheet could split off as a cell (at a comma,
 * a semicolon or a tab) is neutralised like a cell.
 */
export function commentText(text: string): string {
  return text
    .replace(/[\r\n\u2028\u2029]+/g, " ")
    .split(/([,;\t])/)
    .map((piece, i) => (i % 2 ? piece : safeCell(piece)))
    .join("");
}
