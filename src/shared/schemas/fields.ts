/**
 * Every field schema in one import, for the server and the editors: text, e-mail, ids and dates
 * (basic-fields.ts) and decimals sized to their columns (decimal-fields.ts). Code that must stay
 * light (the sign-in page) imports basic-fields.ts alone.
 */
export * from './basic-fields';
export * from './decimal-fields';
