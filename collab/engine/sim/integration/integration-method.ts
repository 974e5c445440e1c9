/**
 * An implicit integration formula, written for a state x with derivative x' as
 *   x'(t + h) ≈ a0(h)·x(t + h) − history(h, x(t), x'(t)).
 * Capacitors (x = voltage, C·x' = current) and inductors (x = current, L·x' = voltage) build
 * their companion models from these two numbers, so the formulas are interchangeable.
 */
export interface IntegrationMethod {
  readonly name: 'backward-euler' | 'trapezoidal';
  /** Order of accuracy; the truncation error is O(h^(order+1)). */
  readonly order: number;
  /** Coefficient of x(t + h) in the derivative estimate. */
  coefficient(h: number): number;
  /** Known part of the derivative estimate, from the accepted state at t. */
  history(h: number, x: number, dx: number): number;
  /**
   * Local truncation error of one step of size h, given the divided difference of order
   * `order + 1` of the solution over the last `order + 2` points. Must be (a factor of h)·|dd|:
   * the error estimate calls it once per step with dd = 1 and scales the result per node.
   */
  truncationError(h: number, dividedDifference: number): number;
}
