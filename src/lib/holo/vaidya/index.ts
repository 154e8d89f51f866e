/** Thin-shell AdS–Vaidya quench: HRT surfaces of strips, growth analysis, surface profiles (PHYSICS.md, "Quench"). */
export { hrtDeltaArea, curveFor, clearQuenchCache } from './hrt';
export type { HrtAnswer, HrtSurface } from './hrt';
export { analyseGrowth, growthGuides, tsunamiVelocity } from './growth';
export type { Growth, GrowthGuides } from './growth';
export { surfaceAt } from './family';
export type { Surface } from './family';
export { hrtProfile } from './profile';
