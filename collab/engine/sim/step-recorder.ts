/**
 * Accepted time points of a run, stored flat (node voltages only) in buffers that grow by
 * doubling and are reused by the next run of the same compiled circuit.
 */
export class StepRecorder {
  private times = new Float64Array(1024);
  private values: Float64Array;
  count = 0;

  constructor(private readonly width: number) {
    this.values = new Float64Array(1024 * Math.max(width, 1));
  }

  clear(): void {
    this.count = 0;
  }

  push(t: number, x: Float64Array): void {
    if (this.count === this.times.length) this.grow();
    this.times[this.count] = t;
    // A plain loop: `subarray` would allocate a view on every accepted step.
    const w = this.width;
    const base = this.count * w;
    const values = this.values;
    for (let i = 0; i < w; i++) values[base + i] = x[i];
    this.count++;
  }

  private grow(): void {
    const times = new Float64Array(this.times.length * 2);
    times.set(this.times);
    const values = new Float64Array(this.values.length * 2);
    values.set(this.values);
    this.times = times;
    this.values = values;
  }

  /** Copy of the accepted times. */
  stepTimes(): Float64Array {
    return this.times.slice(0, this.count);
  }

  /** Copy of node `node`'s voltage at every accepted time (node -1 = ground: zeros). */
  stepValues(node: number): Float64Array {
    const out = new Float64Array(this.count);
    if (node < 0) return out;
    for (let k = 0; k < this.count; k++) out[k] = this.values[k * this.width + node];
    return out;
  }

  /**
   * Node voltage at the evenly spaced `grid` times by linear interpolation. At a repeated time
   * (a jump) the later value wins, so the grid sees the state just after the jump.
   */
  resample(node: number, grid: Float64Array): Float64Array {
    const out = new Float64Array(grid.length);
    if (node < 0) return out;
    const w = this.width;
    let j = 0;
    for (let g = 0; g < grid.length; g++) {
      const t = grid[g];
      while (j + 1 < this.count && this.times[j + 1] <= t) j++;
      if (j + 1 >= this.count) {
        out[g] = this.values[j * w + node];
        continue;
      }
      const ta = this.times[j];
      const tb = this.times[j + 1];
      const a = this.values[j * w + node];
      const b = this.values[(j + 1) * w + node];
      out[g] = tb > ta ? a + ((b - a) * (t - ta)) / (tb - ta) : b;
    }
    return out;
  }
}
