// The sites endpoints. Each is declared with `endpoint({...})` from './endpoint' and exported;
// src/shared/contract/registry.ts lists this module, so the server, the route table, the
// hostile-input walk and the README read every export of it.
export {};
