/**
 * The probe: the current under the pointer on the sheet (amps at the view's reference voltage)
 * and the probes the user has pinned there. The readout itself comes from the engine's probe.
 *
 * @example probe.moveTo(12_000); probe.pin(); probe.pinned // [12000]
 */
export class ProbeState {
  /** The current under the pointer, in amps at the sheet's reference voltage; undefined off the sheet. */
  amps: number | undefined = $state();
  /** Pinned currents (A, at the sheet's reference voltage), in the order they were dropped. */
  pinned: number[] = $state.raw([]);

  /** Follows the pointer to a current. */
  moveTo(amps: number | undefined): void {
    this.amps = amps !== undefined && Number.isFinite(amps) && amps > 0 ? amps : undefined;
  }

  /** Pins the probe at `amps` (default: where it is now); a current already pinned is not pinned twice. */
  pin(amps = this.amps): void {
    if (amps === undefined || this.pinned.includes(amps)) return;
    this.pinned = [...this.pinned, amps];
  }

  /** Removes one pinned probe. */
  unpin(amps: number): void {
    this.pinned = this.pinned.filter((a) => a !== amps);
  }

  /** Removes every pinned probe (a new view or study). */
  clear(): void {
    this.pinned = [];
    this.amps = undefined;
  }
}
