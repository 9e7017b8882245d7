// Reduced bench for a developer's own measuring: PMCHART_BENCH_QUICK=1 (or `npm run bench -- --quick`) runs
// smaller batches and fewer repeats. Every row then says the count it ran; targets are for the full counts.
export const QUICK = process.env.PMCHART_BENCH_QUICK === '1' || process.argv.includes('--quick');

/** n in a full run, m in a quick one. */
export const scaled = (n, m) => (QUICK ? m : n);
