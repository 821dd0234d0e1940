export * from "./least-squares";
// The seeded generator lives with the linear algebra; fits and their callers get it from here too.
export { type RandomSource, createRandom } from "../linalg/seeded-random";
export * from "./bands";
