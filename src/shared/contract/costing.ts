// The costing endpoints: the preview, cup sizes, ingredients (packs, prices, measures),
// preparations, drinks (costing, the menu, recipe cards), modifiers and the pricing policy.
// Each is declared with `endpoint({...})` in a file of ./costing/ and re-exported here;
// src/shared/contract/registry.ts lists this module, so the server, the route table, the
// hostile-input walk and the README read every export of it.
export * from './costing/preview';
export * from './costing/sizes';
export * from './costing/ingredients';
export * from './costing/preparations';
export * from './costing/drinks';
export * from './costing/modifiers';
export * from './costing/policy';
export * from './costing/common';
