/**
 * A cache of values by the serial number of a piece of text (see Piece.serial), for a thread
 * that is told which pieces a text has without reading them itself: direct-mapped (serial mod
 * size), so a look-up reads two arrays and a newer serial simply takes the place of an older one
 * (whose value is then worked out again when it comes back). Memory is fixed by `size`.
 */
export class SerialCache<T> {
  private readonly serials: Int32Array;
  private readonly values: Array<T | undefined>;
  private readonly mask: number;
  /** The serial epoch (see pieceSerialEpoch) the cached serials belong to. */
  private epoch = 0;

  /** `size` is rounded up to a power of two. */
  constructor(size = 1 << 17) {
    let n = 16;
    while (n < size) n *= 2;
    this.serials = new Int32Array(n).fill(-1);
    this.values = new Array<T | undefined>(n).fill(undefined);
    this.mask = n - 1;
  }

  /** The value kept for `serial`, or undefined. */
  get(serial: number): T | undefined {
    const k = serial & this.mask;
    return this.serials[k] === serial ? this.values[k] : undefined;
  }

  set(serial: number, value: T): void {
    const k = serial & this.mask;
    this.serials[k] = serial;
    this.values[k] = value;
  }

  /** Empties the cache when `epoch` differs from the one its serials belong to (serials were given again from 0). */
  useEpoch(epoch: number): void {
    if (epoch === this.epoch) return;
    this.serials.fill(-1);
    this.values.fill(undefined);
    this.epoch = epoch;
  }
}
