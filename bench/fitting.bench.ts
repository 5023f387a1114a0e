/** `npm run bench:fit`: time to fit each rate law to 1,000 points (median of 15 after warm-up). Prints figures. */
import { fitRateModel, type RateModelKind, type RatePoint } from "../lib/fitting";
import { dataRange, fitSummary, preparePoints, tryFit } from "../lib/fitting/from-dataset";

const R = 8.314462618;
let s = 12345;
const rnd = () => ((s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 0.02; // ±1 % demo noise
const C = Array.from({ length: 1000 }, (_, i) => 20 + i * 1.5);
const T = (i: number) => 320 + (i % 4) * 15;
const data: Record<RateModelKind, RatePoint[]> = {
  power: C.map((c) => ({ concA: c, rate: 3e-5 * c ** 1.5 * (1 + rnd()) })),
  reversible: C.map((c) => ({ concA: c, concR: 1600 - c, rate: (4e-3 * c - 1e-3 * (1600 - c)) * (1 + rnd()) })),
  saturation: C.map((c) => ({ concA: c, rate: ((2 * c) / (300 + c)) * (1 + rnd()) })),
  "saturation-inhibition": C.map((c) => ({ concA: c, rate: ((2 * c) / (300 + c + (c * c) / 800)) * (1 + rnd()) })),
  "power-arrhenius": C.map((c, i) => ({ concA: c, temperature: T(i), rate: 1e-4 * Math.exp((-65000 / R) * (1 / T(i) - 1 / 340)) * c * (1 + rnd()) })),
};

console.log("Fitting 1,000 points (median of 15 runs, after 3 warm-up runs); goal < 200 ms");
for (const [kind, pts] of Object.entries(data) as [RateModelKind, RatePoint[]][]) {
  for (let i = 0; i < 3; i++) fitRateModel(kind, pts);
  const times: number[] = [];
  let fit = fitRateModel(kind, pts);
  for (let i = 0; i < 15; i++) {
    const t0 = performance.now();
    fit = fitRateModel(kind, pts);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const params = fit.parameters.map((p) => `${p.name}=${p.value.toPrecision(5)}±${p.standardError.toPrecision(2)}`).join(", ");
  console.log(`  ${kind.padEnd(22)} ${times[7].toFixed(1).padStart(6)} ms   R²=${fit.rSquared.toFixed(5)}  ${params}`);
}

// What POST /api/dataset-versions/:id/fits computes per request (without the database read):
// conversion-only rows → C_A = C_A0(1 − X), the five laws, summaries, range.
const CA0 = 1600;
const rows = C.map((c, i) => ({ conversion: 1 - c / CA0, temperature: T(i), rate: data["power-arrhenius"][i].rate }));
const laws = Object.keys(data) as RateModelKind[];
const once = () => {
  const prepared = preparePoints(rows, CA0);
  dataRange(rows, prepared.points, CA0);
  return laws.map((law) => tryFit(law, prepared)).map((r) => (r.ok ? fitSummary(r.fit) : r.error));
};
for (let i = 0; i < 2; i++) once();
const all: number[] = [];
for (let i = 0; i < 7; i++) {
  const t0 = performance.now();
  once();
  all.push(performance.now() - t0);
}
all.sort((a, b) => a - b);
console.log(`All five laws on 1,000 conversion-only rows, as the fits endpoint does (median of 7): ${all[3].toFixed(1)} ms`);
