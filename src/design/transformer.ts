/**
 * The transformer of an integrated tank (tank.integrated: true), where Lr is the transformer's own
 * leakage. The engineer enters what can be counted and measured: the winding ratio Np/Ns
 * (tank.turnsRatio), the primary inductance with the secondary shorted (tank.lr) and the primary
 * inductance with the secondary open minus that (tank.lm). The models need the equivalent circuit
 * with all leakage on the primary (the cantilever model): series Lr, shunt Lm and an ideal
 * transformer of ratio n_e = k Np/Ns, k = sqrt(Lm / (Lr + Lm)) (derivation in docs/design-file.md,
 * `tank`). A discrete tank has no such difference: its ratio is the ideal transformer's.
 */

/** Coupling coefficient of primary and secondary: k = sqrt(Lm / (Lr + Lm)) (open-circuit Lp = Lr + Lm, shorted Lp (1 - k^2) = Lr). */
export function couplingCoefficient(lr: number, lm: number): number {
  return Math.sqrt(lm / (lr + lm));
}

/**
 * Ratio of the equivalent ideal transformer the models use (FHA, ideal model, deck, measurements):
 * k x windingRatio when integrated, windingRatio otherwise.
 */
export function effectiveTurnsRatio(integrated: boolean, lr: number, lm: number, windingRatio: number): number {
  return integrated ? windingRatio * couplingCoefficient(lr, lm) : windingRatio;
}
