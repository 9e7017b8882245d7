export type { ConcreteLaw, SteelLaw } from './types.js';
export { rectangularBlock } from './rectangular-block.js';
export { parabolaRectangle } from './parabola-rectangle.js';
export { elasticPlasticSteel } from './elastic-plastic-steel.js';
export { inclinedBranchSteel } from './inclined-branch-steel.js';
