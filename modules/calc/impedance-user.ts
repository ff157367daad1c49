// User-entered springs and damping ratios (e.g. from a geotechnical report or a pile-group
// analysis); dashpots c_i = 2 D_i sqrt(k_i M_ii) like the other methods.
import { DOF_KEYS, type Dof6 } from "./dof";
import { constantImpedance, dashpotFromRatio, type ImpedanceContext, type ImpedanceModel } from "./impedance-model";

export function userImpedance(
  ctx: ImpedanceContext,
  stiffness: Dof6,
  dampingRatio: Dof6,
  stiffnessFactor: number,
): ImpedanceModel {
  const k = DOF_KEYS.map((key) => stiffness[key] * stiffnessFactor);
  const c = DOF_KEYS.map((key, i) => dashpotFromRatio(dampingRatio[key], k[i] as number, ctx.massDiagonal[i] as number));
  return constantImpedance("user", k, c, { stiffnessFactor }, []);
}
