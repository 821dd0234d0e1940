export { energyUnits, type EnergyUnit, HARTREE_IN_EV, RYDBERG_IN_EV, electronvoltsPerUnit, toElectronvolts } from "./energy";
export { BOHR_IN_ANGSTROM, bohrToAngstrom, inverseBohrToInverseAngstrom, twoPiOverAToInverseAngstrom } from "./length";
