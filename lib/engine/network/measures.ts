import { ensure } from "../errors";
import { makeKinetics, type Kinetics } from "./kinetics";
import type { ResolvedNetwork } from "./resolve";
import type { StreamMeasures } from "./types";

/**
 * What a stream achieved, measured against the network's feed:
 * X = 1 - F_K/F_K0, Y = (F_P - F_P0)/F_K0, S = (F_P - F_P0)/(F_K0 - F_K) (null at zero conversion, where
 * it is undefined), and every outlet concentration at the stream's temperature (a gas's at its own total
 * molar flow and that temperature).
 */
export function streamMeasures(network: ResolvedNetwork | Kinetics, flows: ArrayLike<number>, T: number, product?: string): StreamMeasures {
  const kin = "weight" in network ? network : makeKinetics(network);
  const net = kin.net;
  const F = Float64Array.from(flows);
  const fk0 = net.F0[net.key];
  const consumed = fk0 - F[net.key];
  const conversion = consumed / fk0;
  let yieldValue: number | null = null;
  let selectivity: number | null = null;
  if (product !== undefined) {
    const p = net.index.get(product);
    ensure(p !== undefined, `the product "${product}" is not in the feed`, "objective.product");
    const formed = F[p] - net.F0[p];
    yieldValue = formed / fk0;
    // "Zero conversion" up to round-off of the key reactant's flow: a ratio of two round-off errors
    // would be noise, not a selectivity.
    selectivity = Math.abs(consumed) <= 4 * Number.EPSILON * fk0 ? null : formed / consumed;
  }
  const C = new Float64Array(net.nSpecies);
  kin.concentrations(F, T, C);
  const outlet: Record<string, number> = {};
  net.species.forEach((s, i) => {
    outlet[s] = C[i];
  });
  return { conversion, yield: yieldValue, selectivity, outlet };
}
