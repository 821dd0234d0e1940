/**
 * Numbers distinct k vectors in order of first sight, by exact equality of their components (0 and −0 are
 * the same). A hash table over the components' bits instead of a Map of string keys: no string per point.
 */
export class KPointIndex {
  private readonly bits = new Uint32Array(new Float64Array(1).buffer);
  private readonly bitsAsFloat = new Float64Array(this.bits.buffer);
  private readonly firstWithHash = new Map<number, number>();
  private nextWithHash = new Int32Array(1024);
  /** Components of each distinct k-point, 1/Å; the first `size` entries are used. */
  xs = new Float64Array(1024);
  ys = new Float64Array(1024);
  zs = new Float64Array(1024);
  size = 0;

  private mix(h: number, v: number): number {
    this.bitsAsFloat[0] = v;
    return Math.imul(Math.imul(h ^ this.bits[0], 0x01000193) ^ this.bits[1], 0x01000193);
  }

  /** FNV-1a style mixing of the six 32-bit words of the components. */
  private hashOf(x: number, y: number, z: number): number {
    return this.mix(this.mix(this.mix(0x811c9dc5, x), y), z);
  }

  /**
   * The index of k = (x, y, z), adding it when new.
   * @param x - Cartesian component, 1/Å (likewise y, z)
   */
  indexOf(x: number, y: number, z: number): number {
    // Adding 0 turns −0 into 0, so the two hash alike.
    x += 0;
    y += 0;
    z += 0;
    const hash = this.hashOf(x, y, z);
    const first = this.firstWithHash.get(hash);
    for (let i = first ?? -1; i !== -1; i = this.nextWithHash[i])
      if (this.xs[i] === x && this.ys[i] === y && this.zs[i] === z) return i;
    const index = this.size++;
    if (index === this.xs.length) this.grow();
    this.xs[index] = x;
    this.ys[index] = y;
    this.zs[index] = z;
    this.nextWithHash[index] = first ?? -1;
    this.firstWithHash.set(hash, index);
    return index;
  }

  private grow(): void {
    const capacity = this.xs.length * 2;
    const grow = <T extends Float64Array | Int32Array>(a: T, make: (n: number) => T): T => {
      const next = make(capacity);
      next.set(a);
      return next;
    };
    this.xs = grow(this.xs, (n) => new Float64Array(n));
    this.ys = grow(this.ys, (n) => new Float64Array(n));
    this.zs = grow(this.zs, (n) => new Float64Array(n));
    this.nextWithHash = grow(this.nextWithHash, (n) => new Int32Array(n));
  }
}
