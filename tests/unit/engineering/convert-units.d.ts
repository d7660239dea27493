// convert-units 2.3.4 ships no types; the tests only use from/to.
declare module 'convert-units' {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  export default function convert(value?: number): Converter;
}
