export {
  PHASE_CONVENTION,
  type ParameterSet,
  type ParameterSetProvenance,
  buildParameterSet,
  parameterSetJsonSchema,
  parameterSetSchema,
} from "./parameter-set";
export { DENSE_PATH_POINTS_PER_INVERSE_ANGSTROM, type ResidualCsvRow, bandsCsv, residualsCsv } from "./csv";
