/** Three-point Gauss–Legendre rule on [0, 1]: exact for polynomials up to degree 5. */
const g = Math.sqrt(3 / 5) / 2;
export const GAUSS3_T = [0.5 - g, 0.5, 0.5 + g] as const;
export const GAUSS3_W = [5 / 18, 8 / 18, 5 / 18] as const;
