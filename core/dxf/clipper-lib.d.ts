// clipper-lib ships no types; the writer wraps the few calls it uses in trenchOutline.ts.
declare module 'clipper-lib';
