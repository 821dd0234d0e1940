export { CONVENTIONS, ORBITAL_DEFINITIONS } from "./conventions";
export { type ParameterSet, type ParameterSetBond, parameterSetJsonSchema, parameterSetSchema } from "./parameter-set-schema";
export { type ParameterSetProvenance, type ParameterSetSettings, buildParameterSet } from "./parameter-set";
export { DENSE_PATH_POINTS_PER_INVERSE_ANGSTROM, type ResidualCsvRow, bandsCsv, residualsCsv } from "./csv";
