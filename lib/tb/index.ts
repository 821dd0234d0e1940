export type { Vec3 } from "./geometry/vec3";
export { add, combine, cross, dot, norm, scale, sub } from "./geometry/vec3";
export { cartesianToReduced, completeLattice, reciprocalLattice, reducedToCartesian } from "./geometry/lattice";
export { type KPath, type KPathDensity, type KPathTick, type KPathVertex, buildKPath } from "./geometry/kpath";
export {
  type NeighbourBond,
  type NeighbourShells,
  type ShellSearchOptions,
  type Translation,
  findNeighbourShells,
} from "./geometry/shells";
export { ORBITAL_NAMES, type OrbitalName, type OrbitalShell, orbitalShell } from "./model/orbitals";
export {
  type HoppingEntry,
  type KPathPoint,
  type ModelDocument,
  type ModelDocumentInput,
  type ModelParameter,
  type ModelSite,
  bondIntegralKeySchema,
  modelDocumentSchema,
  modelParameterSchema,
} from "./model/schema";
export { type ModelIssue, ModelError } from "./model/errors";
export {
  type BondIntegralKey,
  SPECIES_SEPARATOR,
  bondIntegralName,
  bondIntegralOf,
  canonicalParameterName,
  onsiteOf,
  onsiteParameterName,
} from "./model/parameter-names";
export {
  type BondIntegralOrigin,
  type CompiledModel,
  type CompiledOrbital,
  type ModelMatrix,
  type ModelTerm,
  compileModel,
} from "./model/compile";
export {
  BOND_KINDS,
  BOND_TYPES,
  type BondKind,
  type BondType,
  SHELL_PAIRS,
  type ShellPair,
  splitBondType,
} from "./slater-koster/bond-types";
export { type BondIntegralValues, slaterKosterElement } from "./slater-koster/table";
export {
  HARRISON_ETA,
  HBAR2_OVER_M,
  type HarrisonBondType,
  harrisonBondIntegrals,
  withHarrisonStartingValues,
} from "./slater-koster/harrison";
export {
  type PreparedHamiltonian,
  type PreparedMatrix,
  assembleHamiltonian,
  assembleMatrix,
  assembleOverlap,
  hamiltonianAt,
  hamiltonianDerivativeAt,
  overlapAt,
  overlapDerivativeAt,
  prepareHamiltonian,
} from "./hamiltonian/prepare";
export { type RealSpaceContribution, type RealSpaceElement, type RealSpaceModel, expandHoppings } from "./hamiltonian/expand";
export {
  type BandGradientOptions,
  type BandsWithGradients,
  type ComputeBandsOptions,
  type ComputedBands,
  bandsWithGradients,
  computeBands,
} from "./bands/bands";
export {
  TEMPLATE_IDS,
  type ParameterOverrides,
  type TemplateId,
  type TemplateOptions,
  type TemplateSummary,
  buildTemplate,
  kPathVertices,
  listTemplates,
  templateKPath,
} from "./templates/catalogue";
