// The `dxf` npm package (independent reader used by the tests) ships no types.
declare module 'dxf';
