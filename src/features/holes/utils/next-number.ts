/**
 * The next hole number after the project's existing ones: the most used prefix (`TH-`) with
 * one more than its highest number, padded like the others (`TH-15`). `TH-01` for the first.
 */
export function nextHoleNumber(numbers: readonly string[]): string {
  const byPrefix = new Map<string, { count: number; max: number; width: number }>();
  for (const n of numbers) {
    const m = /^(.*?)(\d+)$/.exec(n.trim());
    if (!m) continue;
    const prefix = m[1]!;
    const digits = m[2]!;
    const entry = byPrefix.get(prefix) ?? { count: 0, max: 0, width: 0 };
    entry.count++;
    entry.max = Math.max(entry.max, Number(digits));
    entry.width = Math.max(entry.width, digits.length);
    byPrefix.set(prefix, entry);
  }
  let best: [string, { count: number; max: number; width: number }] | null = null;
  for (const e of byPrefix) if (!best || e[1].count > best[1].count) best = e;
  if (!best) return 'TH-01';
  const [prefix, { max, width }] = best;
  return `${prefix}${String(max + 1).padStart(width, '0')}`;
}
