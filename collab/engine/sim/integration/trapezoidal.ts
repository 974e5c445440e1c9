import type { IntegrationMethod } from './integration-method';

/**
 * Trapezoidal rule: (x'(t) + x'(t+h))/2 ≈ (x(t+h) − x(t))/h, hence
 * x'(t+h) ≈ (2/h)·x(t+h) − (2/h·x(t) + x'(t)). Second order, A-stable, no numerical damping.
 * Error term −h³/12·x''' with x''' = 6·(third divided difference) (standard numerical analysis).
 */
export const trapezoidal: IntegrationMethod = {
  name: 'trapezoidal',
  order: 2,
  coefficient: (h) => 2 / h,
  history: (h, x, dx) => (2 * x) / h + dx,
  truncationError: (h, dd3) => (h * h * h * Math.abs(dd3)) / 2,
};
