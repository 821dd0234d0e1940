import { describe, expect, it } from "vitest";
import { createRandom, eigenHermitian } from "@/lib/linalg";
import {
  type ModelDocument,
  type Vec3,
  bandsWithGradients,
  buildTemplate,
  compileModel,
  computeBands,
  hamiltonianAt,
  hamiltonianDerivativeAt,
  prepareHamiltonian,
} from "@/lib/tb";
import { realGaugeOf } from "@/lib/tb/hamiltonian/real-gauge";

const random = createRandom(20261202);
const randomK = (): Vec3 => [random.uniformIn(-1.5, 1.5), random.uniformIn(-1.5, 1.5), random.uniformIn(-1.5, 1.5)];

/** Reference: the complex Hermitian solver on H(k) and ⟨ψ|∂H/∂θ|ψ⟩ from its eigenvectors (Hellmann–Feynman). */
function complexReference(doc: ModelDocument, theta: Float64Array, k: Vec3) {
  const compiled = compileModel(doc);
  const n = compiled.orbitalCount;
  const eigen = eigenHermitian(hamiltonianAt(compiled, theta, k));
  const gradients = compiled.parameters.map((_, p) => {
    const d = hamiltonianDerivativeAt(compiled, p, k);
    return Array.from({ length: n }, (_, m) => {
      let sum = 0;
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          const [ar, ai] = [eigen.vectorsRe[m * n + i], -eigen.vectorsIm[m * n + i]];
          const [br, bi] = [eigen.vectorsRe[m * n + j], eigen.vectorsIm[m * n + j]];
          const [dr, di] = [d.re[i * n + j], d.im[i * n + j]];
          sum += ar * (dr * br - di * bi) - ai * (dr * bi + di * br); // Re(conj ψ_i D_ij ψ_j)
        }
      return sum;
    });
  });
  return { values: eigen.values, gradients };
}

describe("real gauge of inversion- and time-reversal-symmetric models", () => {
  it("is found for centrosymmetric templates and refused for zincblende, overlaps and complex hoppings", () => {
    // Diamond has inversion through the bond centre (site A ↔ site B); zincblende has none (common practice).
    expect(Array.from(realGaugeOf(compileModel(buildTemplate("diamond-sp3s-star")))!.partner)).toEqual([5, 6, 7, 8, 9, 0, 1, 2, 3, 4]);
    expect(realGaugeOf(compileModel(buildTemplate("zincblende-sp3s-star")))).toBeNull();
    expect(realGaugeOf(compileModel(buildTemplate("honeycomb-pz", { overlap: true })))).toBeNull();
    const chain = buildTemplate("chain-s");
    const complexHopping: ModelDocument = {
      ...chain,
      hoppings: chain.hoppings?.map((h) => ({ ...h, factor: [0.6, 0.8] as [number, number] })),
    };
    expect(chain.hoppings?.length).toBeGreaterThan(0);
    expect(realGaugeOf(compileModel(complexHopping))).toBeNull();
  });

  it("satisfies P H(k) P = H(k)* element by element at random k and θ (the property the real path rests on)", () => {
    for (const id of ["diamond-sp3s-star", "honeycomb-pz", "fcc-spd"]) {
      const compiled = compileModel(buildTemplate(id));
      const gauge = realGaugeOf(compiled)!;
      const n = compiled.orbitalCount;
      const theta = compiled.initialValues.map((x) => x * random.uniformIn(0.7, 1.3));
      const h = hamiltonianAt(compiled, theta, randomK());
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          const sign = gauge.parity[i] * gauge.parity[j];
          const mirrored = (gauge.partner[i] * n + gauge.partner[j]) as number;
          expect(sign * h.re[mirrored]).toBeCloseTo(h.re[i * n + j], 12);
          expect(sign * h.im[mirrored]).toBeCloseTo(-h.im[i * n + j], 12);
        }
    }
  });

  it("gives the complex solver's energies and Hellmann–Feynman gradients (sp3s* Si, honeycomb pz, fcc spd)", () => {
    for (const id of ["diamond-sp3s-star", "honeycomb-pz", "fcc-spd"]) {
      const doc = buildTemplate(id);
      const compiled = compileModel(doc);
      const n = compiled.orbitalCount;
      const np = compiled.parameters.length;
      const ks = [randomK(), randomK(), randomK()];
      const theta = compiled.initialValues.map((x) => x * random.uniformIn(0.7, 1.3));
      const fast = bandsWithGradients(prepareHamiltonian(compiled, ks), theta);
      ks.forEach((k, ki) => {
        const reference = complexReference(doc, theta, k);
        for (let m = 0; m < n; m++) {
          expect(fast.energies[ki * n + m]).toBeCloseTo(reference.values[m], 10);
          for (let p = 0; p < np; p++) expect(fast.gradients![(ki * n + m) * np + p]).toBeCloseTo(reference.gradients[p][m], 8);
        }
      });
    }
  });

  it("returns eigenvectors of H(k) itself (H ψ = E ψ, ψ†ψ = 1) from computeBands", () => {
    const compiled = compileModel(buildTemplate("diamond-sp3s-star"));
    const n = compiled.orbitalCount;
    const k = randomK();
    const bands = computeBands(compiled, undefined, [k], { eigenvectors: true });
    const h = hamiltonianAt(compiled, compiled.initialValues, k);
    for (let m = 0; m < n; m++) {
      const vr = bands.eigenvectorsRe!.subarray(m * n, m * n + n);
      const vi = bands.eigenvectorsIm!.subarray(m * n, m * n + n);
      let norm = 0;
      for (let i = 0; i < n; i++) {
        let sr = 0;
        let si = 0;
        for (let j = 0; j < n; j++) {
          sr += h.re[i * n + j] * vr[j] - h.im[i * n + j] * vi[j];
          si += h.re[i * n + j] * vi[j] + h.im[i * n + j] * vr[j];
        }
        expect(sr).toBeCloseTo(bands.energies[m] * vr[i], 10);
        expect(si).toBeCloseTo(bands.energies[m] * vi[i], 10);
        norm += vr[i] ** 2 + vi[i] ** 2;
      }
      expect(norm).toBeCloseTo(1, 12);
    }
  });

  it("computes gradients of the requested bands only, equal to the full computation, the others 0", () => {
    for (const id of ["diamond-sp3s-star", "zincblende-sp3s-star"]) {
      const compiled = compileModel(buildTemplate(id));
      const n = compiled.orbitalCount;
      const np = compiled.parameters.length;
      const prepared = prepareHamiltonian(compiled, [randomK(), randomK()]);
      const full = bandsWithGradients(prepared, compiled.initialValues).gradients!;
      const some = bandsWithGradients(prepared, compiled.initialValues, { gradientBands: [2, 6] }).gradients!;
      for (let i = 0; i < full.length; i++) {
        const band = Math.floor(i / np) % n;
        expect(some[i]).toBe(band >= 2 && band <= 6 ? full[i] : 0);
      }
      expect(() => bandsWithGradients(prepared, compiled.initialValues, { gradientBands: [3, n] })).toThrow(RangeError);
    }
  });
});
