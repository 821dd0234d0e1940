export { type ComplexMatrix, complexMatrixFromRows, createComplexMatrix, hermiticityDefect } from "./complex-matrix";
export {
  type EigenOutput,
  type HermitianEigenSolver,
  createEigenOutput,
  createHermitianEigenSolver,
  eigenHermitian,
} from "./hermitian-eigen";
export { type SymmetricEigenSolver, createSymmetricEigenSolver } from "./symmetric-eigen";
export { type GeneralisedEigenSolver, createGeneralisedEigenSolver } from "./generalised-eigen";
export { type RandomSource, createRandom } from "./seeded-random";
export { type ClusterDerivatives, clusterDerivatives, nearDegenerateClusters } from "./degenerate-subspace";
