export { energyUnits, type EnergyUnit, HARTREE_IN_EV, RYDBERG_IN_EV, electronvoltsPerUnit, toElectronvolts } from "./energy";
export { BOHR_IN_ANGSTROM, bohrToAngstrom, inverseBohrToInverseAngstrom, twoPiOverAToInverseAngstrom } from "./length";
export {
  type CrystalMomentum,
  FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV,
  type PhotoemissionPoint,
  anglesForCrystalMomentum,
  photoelectronWaveVector,
  photoemissionPointSchema,
  photoemissionToCrystal,
} from "./photoemission";
