// A tiny library (invented for this test) that the reference extractor reads instead of lib/.
export * from "./optics/lens.ts";
export const NOT_A_FUNCTION = 3;
