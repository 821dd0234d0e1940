import type { LeastSquaresProblem } from "@/lib/fit/least-squares";

/**
 * NIST StRD nonlinear regression datasets, transcribed from the NIST Statistical Reference Datasets
 * (itl.nist.gov/div898/strd/nls), via shared/REFERENCES.md §6 (stored). Certified values are NIST's.
 */
export interface NistDataset {
  name: string;
  /** (y, x) pairs as NIST lists them. */
  data: [number, number][];
  starts: [number[], number[]];
  certifiedValues: number[];
  certifiedStandardDeviations: number[];
  certifiedResidualSumOfSquares: number;
  model: (b: number[], x: number) => number;
  gradient: (b: number[], x: number) => number[];
}

export const misra1a: NistDataset = {
  name: "Misra1a",
  data: [
    [10.07, 77.6], [14.73, 114.9], [17.94, 141.1], [23.93, 190.8], [29.61, 239.9], [35.18, 289.0],
    [40.02, 332.8], [44.82, 378.4], [50.76, 434.8], [55.05, 477.3], [61.01, 536.8], [66.4, 593.1],
    [75.47, 689.1], [81.78, 760.0],
  ],
  starts: [[500, 1e-4], [250, 5e-4]],
  certifiedValues: [2.3894212918e2, 5.5015643181e-4],
  certifiedStandardDeviations: [2.7070075241e0, 7.2668688436e-6],
  certifiedResidualSumOfSquares: 1.2455138894e-1,
  model: ([b1, b2], x) => b1 * (1 - Math.exp(-b2 * x)),
  gradient: ([b1, b2], x) => [1 - Math.exp(-b2 * x), b1 * x * Math.exp(-b2 * x)],
};

export const mgh09: NistDataset = {
  name: "MGH09",
  data: [
    [1.957e-1, 4.0], [1.947e-1, 2.0], [1.735e-1, 1.0], [1.6e-1, 0.5], [8.44e-2, 0.25], [6.27e-2, 0.167],
    [4.56e-2, 0.125], [3.42e-2, 0.1], [3.23e-2, 0.0833], [2.35e-2, 0.0714], [2.46e-2, 0.0625],
  ],
  starts: [[25, 39, 41.5, 39], [0.25, 0.39, 0.415, 0.39]],
  certifiedValues: [1.9280693458e-1, 1.9128232873e-1, 1.2305650693e-1, 1.3606233068e-1],
  certifiedStandardDeviations: [1.1435312227e-2, 1.9633220911e-1, 8.0842031232e-2, 9.0025542308e-2],
  certifiedResidualSumOfSquares: 3.0750560385e-4,
  model: ([b1, b2, b3, b4], x) => (b1 * (x * x + x * b2)) / (x * x + x * b3 + b4),
  gradient: ([b1, b2, b3, b4], x) => {
    const numerator = x * x + x * b2;
    const denominator = x * x + x * b3 + b4;
    return [
      numerator / denominator,
      (b1 * x) / denominator,
      (-b1 * numerator * x) / denominator ** 2,
      (-b1 * numerator) / denominator ** 2,
    ];
  },
};

export const thurber: NistDataset = {
  name: "Thurber",
  data: [
    [80.574, -3.067], [84.248, -2.981], [87.264, -2.921], [87.195, -2.912], [89.076, -2.84], [89.608, -2.797],
    [89.868, -2.702], [90.101, -2.699], [92.405, -2.633], [95.854, -2.481], [100.696, -2.363], [101.06, -2.322],
    [401.672, -1.501], [390.724, -1.46], [567.534, -1.274], [635.316, -1.212], [733.054, -1.1], [759.087, -1.046],
    [894.206, -0.915], [990.785, -0.714], [1090.109, -0.566], [1080.914, -0.545], [1122.643, -0.4],
    [1178.351, -0.309], [1260.531, -0.109], [1273.514, -0.103], [1288.339, 0.01], [1327.543, 0.119],
    [1353.863, 0.377], [1414.509, 0.79], [1425.208, 0.963], [1421.384, 1.006], [1442.962, 1.115],
    [1464.35, 1.572], [1468.705, 1.841], [1447.894, 2.047], [1457.628, 2.2],
  ],
  starts: [[1000, 1000, 400, 40, 0.7, 0.3, 0.03], [1300, 1500, 500, 75, 1, 0.4, 0.05]],
  certifiedValues: [
    1.28813968e3, 1.4910792535e3, 5.8323836877e2, 7.5416644291e1, 9.6629502864e-1, 3.9797285797e-1,
    4.9727297349e-2,
  ],
  certifiedStandardDeviations: [
    4.6647963344e0, 3.9571156086e1, 2.8698696102e1, 5.567537027e0, 3.1333340687e-2, 1.4984928198e-2,
    6.5842344623e-3,
  ],
  certifiedResidualSumOfSquares: 5.6427082397e3,
  model: ([b1, b2, b3, b4, b5, b6, b7], x) =>
    (b1 + b2 * x + b3 * x ** 2 + b4 * x ** 3) / (1 + b5 * x + b6 * x ** 2 + b7 * x ** 3),
  gradient: ([b1, b2, b3, b4, b5, b6, b7], x) => {
    const numerator = b1 + b2 * x + b3 * x ** 2 + b4 * x ** 3;
    const denominator = 1 + b5 * x + b6 * x ** 2 + b7 * x ** 3;
    const q = -numerator / denominator ** 2;
    return [1, x, x ** 2, x ** 3].map((power) => power / denominator).concat([x * q, x ** 2 * q, x ** 3 * q]);
  },
};

/** The dataset as a least-squares problem from one of NIST's two starts (σ = 1, as NIST fits). */
export function nistProblem(dataset: NistDataset, start: 0 | 1, withJacobian = true): LeastSquaresProblem {
  const xs = dataset.data.map(([, x]) => x);
  const p = dataset.certifiedValues.length;
  return {
    parameters: dataset.starts[start].map((initial, j) => ({ name: `b${j + 1}`, initial })),
    observed: dataset.data.map(([y]) => y),
    evaluate: (theta) => xs.map((x) => dataset.model(Array.from(theta), x)),
    jacobian: withJacobian
      ? (theta) => {
          const out = new Float64Array(xs.length * p);
          xs.forEach((x, i) => out.set(dataset.gradient(Array.from(theta), x), i * p));
          return out;
        }
      : undefined,
  };
}
