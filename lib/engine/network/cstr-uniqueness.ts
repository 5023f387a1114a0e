import type { ResolvedNetwork } from "./resolve";

/**
 * Whether every isothermal stirred tank of this network has exactly one steady state, whatever its inlet,
 * volume and temperature: then Newton from the feed finds THE state, which is also the lowest-conversion
 * one, and the designer's search may use it (the cheap path of cstrSteadyStates).
 *
 * The test is Soulé's graphic condition for a single steady state (C. Soulé, "Graphic requirements for
 * multistationarity", ComPlexUs 1, 2003; the proof of Thomas's conjecture): when for every composition the
 * signed graph of the Jacobian of the balance G(F) = F_in - F + V R(F) on the open orthant has no positive
 * circuit, G is injective there, so the tank has at most one state. The graph's edges are read from the
 * structure of the rate laws, not from numbers: species q acts on species i through reaction j with the
 * sign of nu_ij times the sign of dr_j/dC_q, and an entry whose terms could take either sign is kept with
 * both. The structural graph contains the graph at every composition, so "no circuit that could be
 * positive" in it proves the condition everywhere. The diagonal of the balance's Jacobian is -1 + V dR_i/dF_i:
 * it may be positive (a positive loop) when some reaction forms i at a rate that grows with C_i
 * (autocatalysis).
 *
 * Conservative by design: a liquid network of power laws without feedback (series, parallel, Van de Vusse)
 * passes; an expression law (its dependence on each species is not known), a gas (every concentration
 * depends on every flow through the total flow) or a circuit of influences that could close with a positive
 * sign (autocatalysis, direct or through intermediates) does not pass, and the designer then solves every
 * tank with the full steady-state search during the search too. A zero-order reactant counts as a positive
 * dependence (the reaction stops when it runs out).
 */
export function tanksHaveOneState(net: ResolvedNetwork): boolean {
  if (net.phase !== "liquid") return false;
  const n = net.nSpecies;
  const m = net.nReactions;
  // edge[q * n + i]: bit 1 = q may raise R_i, bit 2 = q may lower R_i.
  const edge = new Uint8Array(n * n);
  for (let j = 0; j < m; j++) {
    const law = net.rates[j];
    if (law.opaque) return false;
    for (let q = 0; q < n; q++) {
      // Sign of dr_j/dC_q: the forward term rises with its reactants, the reverse term lowers r_j.
      let dep = 0;
      const nuq = net.nu[q * m + j];
      if (law.forwardOrders[q] > 0 || (law.forwardOrders[q] === 0 && nuq < 0 && net.depleting[q].includes(j))) dep |= 1;
      if (law.reverseOrders !== null && (law.reverseOrders[q] > 0 || (law.reverseOrders[q] === 0 && nuq > 0 && net.depleting[q].includes(j)))) dep |= 2;
      if (dep === 0) continue;
      for (let i = 0; i < n; i++) {
        const nu = net.nu[i * m + j];
        if (nu === 0) continue;
        const up = nu > 0 ? 1 : 2;
        const down = nu > 0 ? 2 : 1;
        if (dep & 1) edge[q * n + i] |= up;
        if (dep & 2) edge[q * n + i] |= down;
      }
    }
  }
  // A loop on i: -1 + V dR_i/dF_i may be positive when dR_i/dF_i may be.
  for (let i = 0; i < n; i++) if (edge[i * n + i] & 1) return false;
  return !positiveCircuit(edge, n);
}

/**
 * Whether some elementary circuit of length >= 2 can have a positive sign (an even number of negative
 * edges, an edge of either sign chosen freely). Exhaustive over circuits by their lowest node: states
 * (nodes visited, node reached, parity), at most 2^11 * 12 * 2 per start for 12 species.
 */
function positiveCircuit(edge: Uint8Array, n: number): boolean {
  for (let s = 0; s < n; s++) {
    const seen = new Set<number>();
    const stack: [number, number, number][] = [[1 << s, s, 0]];
    while (stack.length > 0) {
      const [mask, v, parity] = stack.pop()!;
      for (let w = s; w < n; w++) {
        const e = edge[v * n + w];
        if (e === 0 || w === v) continue;
        for (const sign of [1, 2]) {
          if (!(e & sign)) continue;
          const next = parity ^ (sign === 2 ? 1 : 0);
          if (w === s) {
            if (next === 0 && mask !== 1 << s) return true;
            continue;
          }
          if (mask & (1 << w)) continue;
          const nextMask = mask | (1 << w);
          const key = (nextMask * n + w) * 2 + next;
          if (seen.has(key)) continue;
          seen.add(key);
          stack.push([nextMask, w, next]);
        }
      }
    }
  }
  return false;
}
