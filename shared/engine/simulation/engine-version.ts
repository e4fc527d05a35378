/**
 * Version of the simulation engine, stored with every result. Same seed + same version → the same
 * numbers. Bump it whenever a change alters the random stream, the samplers or the estimators
 * (the golden-value tests fail first and say so).
 */
export const SIMULATION_ENGINE_VERSION = 'plumbline-simulation-1';
