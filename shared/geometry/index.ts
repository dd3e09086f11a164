/**
 * Geometry and clearance engine of Threadline (SPEC §4), shared by server and client.
 * Pure TypeScript, no I/O. Import from '@shared/geometry'.
 */
export * from './errors';
export * from './planar';
export * from './polyline';
export * from './station';
export * from './profile';
export * from './crs';
export * from './geodesic';
export * from './line-elevation';
export * from './closest3d';
export * from './clearance';
export * from './pit';
export * from './window';
export * from './spatial-index';
export * from './crossing';
export * from './presets';
export * from './types';
export {
  computeClearances, analyseBore, prepareScene, prepareBore, findCandidates, analyseLine, pitConflictsOf, type EngineOptions,
  type Scene, type LineContext, type BoreContext,
} from './engine';
