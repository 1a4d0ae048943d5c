// convert-units 2.x ships no types; only what the cross-check uses.
declare module 'convert-units' {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  export default function convert(value: number): Converter;
}
