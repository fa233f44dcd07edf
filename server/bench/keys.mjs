// The live keys the benchmark created, passed to the baselines in BENCH_KEYS (comma-separated).
export const benchKeys = () =>
  new Map(
    (process.env.BENCH_KEYS ?? '')
      .split(',')
      .filter(Boolean)
      .map((k) => [k, true]),
  );
