/**
 * Stands in for the file renderers (node-canvas, pdf-lib, file writing) in the browser bundle: the page
 * draws with vega in the browser and never reaches these modules; scripts/bundle.mjs aliases them here.
 */
const unavailable = (): never => {
  throw new Error('drawing to files is not available in the page');
};
export const SheetRenderer = { create: unavailable };
export const writeCheckReport = unavailable;
export const writeFileAtomic = unavailable;
export const ioError = unavailable;
export const fixPdfMetadata = unavailable;
export default {};
