/** The caution every output carries (README, sheets, reports, tables, the page). */
export const CAUTION =
  'For use by qualified engineers only. Check every result against the governing code edition and local practice; local codes and licensed engineering judgement take precedence.';
