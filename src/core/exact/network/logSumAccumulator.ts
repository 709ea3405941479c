/**
 * Running log(Σ exp(x_i)) without overflow or underflow: the sum is kept relative to the largest
 * term seen so far (the usual log-sum-exp shift, common practice).
 */
export class LogSumAccumulator {
  private largest = -Infinity;
  private scaledSum = 0;

  add(logTerm: number): void {
    if (!(logTerm > -Infinity)) return;
    if (logTerm <= this.largest) {
      this.scaledSum += Math.exp(logTerm - this.largest);
    } else {
      this.scaledSum = this.scaledSum * Math.exp(this.largest - logTerm) + 1;
      this.largest = logTerm;
    }
  }

  /** log of the sum; −Infinity when nothing (or only zeros) was added. */
  value(): number {
    return this.scaledSum > 0 ? this.largest + Math.log(this.scaledSum) : -Infinity;
  }
}
