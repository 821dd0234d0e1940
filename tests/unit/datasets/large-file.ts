// A large band file for the parse benchmark (scripts/bench/datasets.ts) and the 500 000-point upload test:
// two straight photoemission-style cuts of a cosine band model, k-point by k-point, all bands per k-point.
// Deterministic (no random numbers), so its bytes and SHA-256 repeat between runs.
import type { DatasetMappingInput } from "@/lib/datasets";

export interface LargeFileOptions {
  /** Bands per k-point. Default 10. */
  bands?: number;
  /** Points in the file (k-points × bands, rounded down to whole k-points). Default 500 000. */
  points?: number;
}

/** The header and mapping of {@link largeBandFile}: cut label, (kx, ky) in 1/Å, band, E and σ in eV. */
export const largeFileMapping: DatasetMappingInput = {
  name: "Large generated band file",
  source: "photoemission",
  format: "long",
  k: { kind: "cartesian", columns: ["kx", "ky"] },
  band: { column: "band" },
  energy: { column: "E_eV", unit: "eV" },
  sigma: { column: "dE_eV" },
  label: { column: "cut" },
};

/**
 * The bytes of a long-format file with `points` energies: cut A along kx, then cut B along the diagonal,
 * each half of the k-points, bands 1…n at every k-point (E = −n/2 + b + 0.3 cos(3k)).
 * @param options - band and point counts
 * @returns UTF-8 bytes (about 38 bytes per point)
 */
export function largeBandFile(options: LargeFileOptions = {}): Uint8Array {
  const bands = options.bands ?? 10;
  const kCount = Math.floor((options.points ?? 500_000) / bands);
  const encoder = new TextEncoder();
  const parts: Uint8Array[] = [encoder.encode("cut,kx,ky,band,E_eV,dE_eV\n")];
  let lines: string[] = [];
  for (let i = 0; i < kCount; i++) {
    const half = i < kCount / 2;
    const t = (half ? i : i - Math.ceil(kCount / 2)) * 1e-4;
    const kx = half ? t : t / Math.SQRT2;
    const ky = half ? 0 : t / Math.SQRT2;
    for (let b = 1; b <= bands; b++) {
      const energy = -bands / 2 + b + 0.3 * Math.cos(3 * t + b);
      lines.push(`${half ? "A" : "B"},${kx.toFixed(5)},${ky.toFixed(5)},${b},${energy.toFixed(5)},0.010`);
    }
    // Encoded a few thousand lines at a time: no single string of the whole file.
    if (lines.length >= 5000 || i === kCount - 1) {
      parts.push(encoder.encode(lines.join("\n") + "\n"));
      lines = [];
    }
  }
  const bytes = new Uint8Array(parts.reduce((n, p) => n + p.byteLength, 0));
  let offset = 0;
  for (const p of parts) {
    bytes.set(p, offset);
    offset += p.byteLength;
  }
  return bytes;
}
