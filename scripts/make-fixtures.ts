import { readFileSync, writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { z } from "zod";
import { createRandom } from "@/lib/linalg";
import { buildTemplate, compileModel, computeBands, kPathVertices, templateKPath, type ModelDocument, type Vec3 } from "@/lib/tb";
import { RYDBERG_IN_EV } from "@/lib/units";

// Writes the example band files of fixtures/ from tight-binding templates plus seeded Gaussian noise.
// Every input is in fixtures/parameters.json; running it again rewrites the same bytes.
// Usage: npx tsx scripts/make-fixtures.ts

const folder = fileURLToPath(new URL("../fixtures/", import.meta.url));

const overridesSchema = z.record(z.string(), z.number());
const parametersSchema = z.object({
  seed: z.number().int(),
  honeycomb: z.object({ file: z.string(), sample: z.string(), template: z.string(), parameters: overridesSchema, totalPoints: z.number().int(), noiseEv: z.number() }),
  silicon: z.object({ file: z.string(), sample: z.string(), template: z.string(), parameters: overridesSchema, totalPoints: z.number().int(), noiseEv: z.number(), unit: z.literal("Ry") }),
  photoemission: z.object({
    file: z.string(),
    sample: z.string(),
    template: z.string(),
    parameters: overridesSchema,
    renormalisation: z.number().positive(),
    diracPointEv: z.number(),
    energyWindowEv: z.tuple([z.number(), z.number()]),
    cuts: z.array(z.object({ label: z.string(), direction: z.tuple([z.number(), z.number()]), halfLengthInverseAngstrom: z.number(), points: z.number().int() })),
    sigmaRangeMeV: z.tuple([z.number(), z.number()]),
  }),
});
const parameters = parametersSchema.parse(JSON.parse(readFileSync(`${folder}parameters.json`, "utf8")));

const random = createRandom(parameters.seed);
const uniform = () => random.uniform();
const gaussian = () => random.gaussian();

function model(template: string, values: Record<string, number>): ModelDocument {
  return buildTemplate(template, { parameters: Object.fromEntries(Object.entries(values).map(([name, value]) => [name, { value }])) });
}

/** Band energies (eV) at each k, lowest first: `energies[k][band]`. */
function bandsAt(doc: ModelDocument, k: readonly Vec3[]): number[][] {
  const compiled = compileModel(doc);
  const { energies } = computeBands(compiled, undefined, k);
  const n = compiled.orbitalCount;
  return k.map((_, i) => Array.from(energies.subarray(i * n, (i + 1) * n)));
}

/** Reduced coordinates of Cartesian k in the basis of the reciprocal vectors: kᵢ = k·aᵢ / 2π. */
const reduced = (k: Vec3, lattice: readonly Vec3[]) => lattice.map((a) => (k[0] * a[0] + k[1] * a[1] + k[2] * a[2]) / (2 * Math.PI));

/** Noisy energies, numbered again by energy as a DFT code numbers them (noise can swap near-degenerate bands). */
const sortedWithNoise = (energies: readonly number[], sigma: number) =>
  energies.map((e) => e + sigma * gaussian()).sort((a, b) => a - b);

const header = (lines: string[]) => lines.map((l) => `# ${l}`);
const write = (file: string, lines: string[]) => writeFileSync(`${folder}${file}`, `${lines.join("\n")}\n`);

function honeycombFile(): void {
  const p = parameters.honeycomb;
  const doc = model(p.template, p.parameters);
  const path = templateKPath(doc, { totalPoints: p.totalPoints });
  const bands = bandsAt(doc, path.k);
  const lattice = doc.lattice.map((a) => a.map((x) => x.toFixed(6)).join(" ")).join("; ");
  const lines = [
    ...header([
      `Halvorsen Quantum Materials Lab — ${p.sample}: DFT-style pz bands along Γ–M–K–Γ (wide format).`,
      `Made by scripts/make-fixtures.ts: template ${p.template}, ${JSON.stringify(p.parameters)}, Gaussian noise σ = ${p.noiseEv} eV.`,
      `k in reduced coordinates of the reciprocal vectors of the lattice (Å): ${lattice}. Energies in eV from the Fermi level.`,
    ]),
    "k_frac_1,k_frac_2,band_1_eV,band_2_eV",
    ...path.k.map((k, i) => {
      const [f1, f2] = reduced(k, doc.lattice);
      const energies = sortedWithNoise(bands[i], p.noiseEv).map((e) => e.toFixed(5));
      return [f1.toFixed(6), f2.toFixed(6), ...energies].join(",");
    }),
  ];
  write(p.file, lines);
}

function siliconFile(): void {
  const p = parameters.silicon;
  const doc = model(p.template, p.parameters);
  const path = templateKPath(doc, { totalPoints: p.totalPoints });
  const bands = bandsAt(doc, path.k);
  // Energies from the valence-band maximum: the fourth band's highest value (two atoms × four sp3 electrons).
  const vbm = Math.max(...bands.map((e) => e[3]));
  const lines = [
    ...header([
      `Halvorsen Quantum Materials Lab — ${p.sample}: sp3s* bands along ${doc.kPath?.map((v) => v.label).join("–")} (long format, tab-separated).`,
      `Made by scripts/make-fixtures.ts: template ${p.template} at its default parameters, Gaussian noise σ = ${p.noiseEv} eV.`,
      `k Cartesian in 1/Å (2π included); energies in Rydberg (1 Ry = ${RYDBERG_IN_EV} eV) from the valence-band maximum.`,
    ]),
    ["k_cart_x", "k_cart_y", "k_cart_z", "path_distance", "band", "energy_Ry"].join("\t"),
  ];
  path.k.forEach((k, i) => {
    sortedWithNoise(bands[i], p.noiseEv).forEach((e, b) => {
      const ry = (e - vbm) / RYDBERG_IN_EV;
      lines.push([...k.map((x) => x.toFixed(6)), path.distance[i].toFixed(6), String(b + 1), ry.toFixed(6)].join("\t"));
    });
  });
  write(p.file, lines);
}

function photoemissionFile(): void {
  const p = parameters.photoemission;
  const doc = model(p.template, p.parameters);
  const kPoint = kPathVertices(doc).find((v) => v.label === "K")?.k;
  if (!kPoint) throw new Error(`template ${p.template} has no K point on its path`);
  const [low, high] = p.energyWindowEv;
  const [sigmaMin, sigmaMax] = p.sigmaRangeMeV;
  const lines = [
    ...header([
      `Halvorsen Quantum Materials Lab — ${p.sample}: photoemission peak positions on two cuts through K.`,
      `Made by scripts/make-fixtures.ts: template ${p.template}, ${JSON.stringify(p.parameters)}, bands divided by ${p.renormalisation}, Dirac point at ${p.diracPointEv} eV,`,
      `kept inside [${low}, ${high}] eV; each peak shifted by Gaussian noise of its own error bar (${sigmaMin}–${sigmaMax} meV).`,
      "kx, ky in 1/Å; E and dE in meV from the Fermi level; branch 1 is the lower cone, 2 the upper.",
    ]),
    "cut,kx,ky,branch,E (meV),dE (meV)",
  ];
  for (const cut of p.cuts) {
    const k: Vec3[] = Array.from({ length: cut.points }, (_, i) => {
      const t = -cut.halfLengthInverseAngstrom + (2 * cut.halfLengthInverseAngstrom * i) / (cut.points - 1);
      return [kPoint[0] + t * cut.direction[0], kPoint[1] + t * cut.direction[1], 0];
    });
    const bands = bandsAt(doc, k);
    for (let branch = 0; branch < 2; branch++) {
      k.forEach((kv, i) => {
        const energy = bands[i][branch] / p.renormalisation + p.diracPointEv;
        const sigmaMeV = sigmaMin + (sigmaMax - sigmaMin) * uniform();
        if (energy < low || energy > high) return;
        const measured = energy * 1000 + sigmaMeV * gaussian();
        lines.push([cut.label, kv[0].toFixed(5), kv[1].toFixed(5), String(branch + 1), measured.toFixed(1), sigmaMeV.toFixed(1)].join(","));
      });
    }
  }
  write(p.file, lines);
}

honeycombFile();
siliconFile();
photoemissionFile();
console.log(`[bandwright] fixtures written to ${folder}`);
