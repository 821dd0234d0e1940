export * from "./least-squares";
export * from "./random";
export * from "./bands";
