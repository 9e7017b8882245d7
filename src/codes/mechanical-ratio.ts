/**
 * Mechanical reinforcement ratio ω = As·fyd/(Ac·fcd), customary on European charts
 * (common practice in European design aids for EN 1992-1-1),
 * against the geometric ratio ρ = As/Ac. For any basis the pair is its design steel yield stress
 * and its normalising stress (fyd and fcd for EN 1992-1-1; fy and f′c for ACI 318 and CSA A23.3).
 */
import type { Basis } from './types.js';

/** ω per unit ρ for a basis: fyd/fcd of its design model and normalisation. */
export const omegaPerRho = (basis: Basis): number => basis.design.steel.yieldStress / basis.normalisingStress;

/** ω = ρ·fyd/fcd. */
export const omegaFromRho = (basis: Basis, rho: number): number => rho * omegaPerRho(basis);

/** ρ = ω·fcd/fyd. */
export const rhoFromOmega = (basis: Basis, omega: number): number => omega / omegaPerRho(basis);
