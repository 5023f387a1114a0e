// Gauss–Kronrod 7–15 nodes and weights (Piessens et al., QUADPACK, 1983; also Kahaner, Moler and Nash,
// Numerical Methods and Software, 1989).
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
  0.741531185599394439863864773280788, 0.58608723546769113029414483825873, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
  0.140653259715525918745189590510238, 0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
const WG = [0.129484966168869693270611432679082, 0.27970539148927666790146777142378, 0.381830050505118944950369775488975, 0.417959183673469387755102040816327];

const fv1 = new Float64Array(7);
const fv2 = new Float64Array(7);

/**
 * One Gauss–Kronrod 15-point panel: the Kronrod estimate and QUADPACK's error estimate
 * |K - G| scaled by (200 |K - G| / resasc)^1.5 (Piessens et al., QUADPACK, routine QK15).
 */
function panel(f: (x: number) => number, a: number, b: number, out: Float64Array, at: number): void {
  const c = 0.5 * (a + b);
  const h = 0.5 * (b - a);
  const fc = f(c);
  let k = fc * WGK[7];
  let g = fc * WG[3];
  let kabs = Math.abs(k);
  for (let j = 0; j < 7; j++) {
    const dx = h * XGK[j];
    const f1 = f(c - dx);
    const f2 = f(c + dx);
    fv1[j] = f1;
    fv2[j] = f2;
    const s = f1 + f2;
    k += WGK[j] * s;
    kabs += WGK[j] * (Math.abs(f1) + Math.abs(f2));
    if (j % 2 === 1) g += WG[(j - 1) / 2] * s;
  }
  const mean = 0.5 * k;
  let asc = WGK[7] * Math.abs(fc - mean);
  for (let j = 0; j < 7; j++) asc += WGK[j] * (Math.abs(fv1[j] - mean) + Math.abs(fv2[j] - mean));
  const ah = Math.abs(h);
  let err = Math.abs((k - g) * h);
  const resasc = asc * ah;
  if (resasc !== 0 && err !== 0) err = resasc * Math.min(1, Math.pow((200 * err) / resasc, 1.5));
  const resabs = kabs * ah;
  if (resabs > Number.MIN_VALUE / (50 * Number.EPSILON)) err = Math.max(50 * Number.EPSILON * resabs, err);
  out[at] = k * h;
  out[at + 1] = err;
}

const single = new Float64Array(2);

/** One fixed 15-point Kronrod panel over [a, b]: a smooth function of a and b, for finite differences. */
export function kronrod15(f: (x: number) => number, a: number, b: number): number {
  panel(f, a, b, single, 0);
  return single[0];
}

/** One fixed 15-point Kronrod panel over [a, b]: [value, QUADPACK's error estimate]. */
export function kronrod15WithError(f: (x: number) => number, a: number, b: number): [number, number] {
  panel(f, a, b, single, 0);
  return [single[0], single[1]];
}

/** Result of an adaptive integration. */
export interface Integral {
  readonly value: number;
  /** Estimated absolute error. */
  readonly error: number;
}

/**
 * Adaptive Gauss–Kronrod (7–15) integral of f over [a, b], bisecting the worst panel until the
 * summed error estimate is below max(absTol, relTol |I|).
 */
export function integrate(f: (x: number) => number, a: number, b: number, relTol = 1e-12, absTol = 0, maxPanels = 200): Integral {
  if (a === b) return { value: 0, error: 0 };
  // Panels stored flat as [a, b, value, error], in a buffer reused between calls (fresh if nested).
  const store = depth === 0 && maxPanels <= MAX_SHARED ? sharedStore : new Float64Array(4 * maxPanels);
  const tmp = depth === 0 ? sharedTmp : new Float64Array(4);
  depth++;
  try {
    return adapt(f, a, b, relTol, absTol, maxPanels, store, tmp);
  } finally {
    depth--;
  }
}

const MAX_SHARED = 400;
const sharedStore = new Float64Array(4 * MAX_SHARED);
const sharedTmp = new Float64Array(4);
let depth = 0;

function adapt(
  f: (x: number) => number,
  a: number,
  b: number,
  relTol: number,
  absTol: number,
  maxPanels: number,
  store: Float64Array,
  tmp: Float64Array,
): Integral {
  store[0] = a;
  store[1] = b;
  panel(f, a, b, store, 2);
  let count = 1;
  let total = store[2];
  let error = store[3];
  while (error > Math.max(absTol, relTol * Math.abs(total)) && count < maxPanels && Number.isFinite(total)) {
    let worst = 0;
    for (let i = 1; i < count; i++) if (store[4 * i + 3] > store[4 * worst + 3]) worst = i;
    const w = 4 * worst;
    const pa = store[w];
    const pb = store[w + 1];
    const m = 0.5 * (pa + pb);
    panel(f, pa, m, tmp, 0);
    panel(f, m, pb, tmp, 2);
    total += tmp[0] + tmp[2] - store[w + 2];
    error += tmp[1] + tmp[3] - store[w + 3];
    store[w + 1] = m;
    store[w + 2] = tmp[0];
    store[w + 3] = tmp[1];
    const n = 4 * count;
    store[n] = m;
    store[n + 1] = pb;
    store[n + 2] = tmp[2];
    store[n + 3] = tmp[3];
    count++;
  }
  return { value: total, error };
}
