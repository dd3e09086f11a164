/**
 * `npm run bench`: every benchmark of the project, one after another in this process.
 * Benchmarks print figures; they never pass or fail on time (machines here are shared).
 * Add a feature's benchmark as another entry of BENCHES.
 */
import { printEngineBench } from './bench-engine';
import { printMapBench } from './bench-map';
import { printApiBench } from './bench-api';

const BENCHES: { name: string; run: () => Promise<void> | void }[] = [
  { name: 'clearance engine', run: printEngineBench },
  { name: 'plan & profile map (headless Chromium)', run: printMapBench },
  { name: 'API under load (10 clients, loopback)', run: printApiBench },
];

for (const bench of BENCHES) {
  console.log(`\n=== ${bench.name} ===`);
  await bench.run();
}
