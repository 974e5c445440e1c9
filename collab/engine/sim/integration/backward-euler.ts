import type { IntegrationMethod } from './integration-method';

/**
 * Backward Euler: x'(t+h) ≈ (x(t+h) − x(t))/h. First order and L-stable, so it is used for
 * the first step and right after every discontinuity, where the trapezoidal rule would ring.
 * Error term −h²/2·x'' with x'' = 2·(second divided difference) (standard numerical analysis).
 */
export const backwardEuler: IntegrationMethod = {
  name: 'backward-euler',
  order: 1,
  coefficient: (h) => 1 / h,
  history: (h, x) => x / h,
  truncationError: (h, dd2) => h * h * Math.abs(dd2),
};
