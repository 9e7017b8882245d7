/** Stands in for `node:path` in the browser bundle (scripts/bundle.mjs aliases it): the calls the CLI modules the page reuses make. */
export function extname(p: string): string {
  const base = p.slice(p.lastIndexOf('/') + 1);
  const dot = base.lastIndexOf('.');
  return dot <= 0 ? '' : base.slice(dot);
}
export const resolve = (...parts: string[]): string => parts[parts.length - 1] ?? '';
/** the page reads no file a chart set names (io/read.ts nodeFileAccess is never called there) */
export const dirname = (p: string): string => (p.includes('/') ? p.slice(0, p.lastIndexOf('/')) || '/' : '.');
export default { extname, resolve, dirname };
