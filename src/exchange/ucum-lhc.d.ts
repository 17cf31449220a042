// The parts of @lhncbc/ucum-lhc (no bundled types) that src/exchange/ucum.ts uses.
declare module '@lhncbc/ucum-lhc' {
  interface UcumLhcUtils {
    validateUnitString(unit: string, suggest?: boolean): { status: 'valid' | 'invalid' | 'error'; ucumCode: string | null; msg: string[] };
    convertUnitTo(from: string, value: number, to: string): { status: 'succeeded' | 'failed' | 'error'; toVal: number | null; msg: string[] };
  }
  const ucum: { UcumLhcUtils: { getInstance(): UcumLhcUtils } };
  export default ucum;
}
