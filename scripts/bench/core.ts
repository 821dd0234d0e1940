// Tight-binding core speed: H(k) assembly + eigen-solve per k-point at 2, 8, 10 and 18 orbitals, and a
// 1000-point sp3s* band structure (goal: < 30 ms on one core).
import {
  BOND_TYPES,
  type ModelDocument,
  type OrbitalShell,
  type Vec3,
  bandsWithGradients,
  bondIntegralName,
  buildTemplate,
  compileModel,
  computeBands,
  orbitalShell,
  prepareHamiltonian,
  splitBondType,
  templateKPath,
} from "../../lib/tb";

/** Median wall time in ms of `repeat` runs after one warm-up. */
function median(repeat: number, work: () => void): number {
  work();
  const times: number[] = [];
  for (let i = 0; i < repeat; i++) {
    const start = performance.now();
    work();
    times.push(performance.now() - start);
  }
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)];
}

/** Diamond with a chosen orbital set per site: sp3 (8 orbitals) or spd (18), nearest neighbours. */
function diamondWith(orbitals: ModelDocument["sites"][number]["orbitals"]): ModelDocument {
  const base = buildTemplate("diamond-sp3s-star");
  const shells = new Set(orbitals.map(orbitalShell));
  // bond types whose two shells (e.g. "pd" in "pdπ") are both present; no s* here
  const bonds = BOND_TYPES.filter((b) => !b.includes("*") && [...splitBondType(b).bond].every((s) => shells.has(s as OrbitalShell)));
  return {
    ...base,
    sites: base.sites.map((s) => ({ ...s, orbitals })),
    parameters: [
      ...[...shells].map((s, i) => ({ name: `E_${s}[Si]`, value: -4 + 3 * i, unit: "eV" as const, free: true })),
      ...bonds.map((b, i) => ({ name: bondIntegralName({ matrix: "hamiltonian", ...splitBondType(b), pair: ["Si", "Si"], shell: 1 }), value: (i % 2 ? 1 : -1) * (1 + 0.1 * i), unit: "eV" as const, free: true })),
    ],
  };
}

export async function run(): Promise<Record<string, unknown>> {
  const models: Record<string, ModelDocument> = {
    "2": buildTemplate("honeycomb-pz"),
    "8": diamondWith(["s", "px", "py", "pz"]),
    "10": buildTemplate("diamond-sp3s-star"),
    "18": diamondWith(["s", "px", "py", "pz", "dxy", "dyz", "dzx", "dx2-y2", "dz2"]),
  };
  // Warm the JIT on every size first, so the first model timed is not penalised.
  for (const doc of Object.values(models)) {
    const compiled = compileModel(doc);
    bandsWithGradients(prepareHamiltonian(compiled, templateKPath(doc, { totalPoints: 200 }).k), compiled.initialValues);
  }
  const hkEig: Record<string, number> = {};
  const hkEigGrad: Record<string, number> = {};
  for (const [size, doc] of Object.entries(models)) {
    const compiled = compileModel(doc);
    const path = templateKPath(doc, { totalPoints: 1000 }).k;
    const prepared = prepareHamiltonian(compiled, path);
    const theta = compiled.initialValues;
    const energiesInto = new Float64Array(path.length * compiled.orbitalCount);
    const gradientsInto = new Float64Array(path.length * compiled.orbitalCount * compiled.parameters.length);
    const values = median(9, () => bandsWithGradients(prepared, theta, { gradients: false, energiesInto }));
    const withGradients = median(9, () => bandsWithGradients(prepared, theta, { energiesInto, gradientsInto }));
    hkEig[size] = round((values * 1000) / path.length);
    hkEigGrad[size] = round((withGradients * 1000) / path.length);
    console.log(
      `${size.padStart(2)} orbitals: ${hkEig[size]} µs/k H(k)+eigenvalues, ${hkEigGrad[size]} µs/k with eigenvectors and ∂E/∂θ (${compiled.parameters.length} parameters)`,
    );
  }
  const sp3 = compileModel(models["10"]);
  const k1000: Vec3[] = templateKPath(models["10"], { totalPoints: 1000 }).k;
  const bandsMs = round(median(9, () => computeBands(sp3, undefined, k1000)));
  console.log(`sp3s* silicon, 1000 k-points, computeBands including H(k) preparation: ${bandsMs} ms (goal < 30 ms)`);
  return { hk_eig_us: hkEig, hk_eig_grad_us: hkEigGrad, bands_sp3s_star_1000k_ms: bandsMs };
}

const round = (x: number) => Math.round(x * 100) / 100;
