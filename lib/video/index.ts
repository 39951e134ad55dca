/** Barrel for lib/video (re-exports only): Y′CbCr and integer code values of BT.709, BT.2020 and BT.2100 signals. */
export * from "./ycbcr.ts";
export * from "./code-values.ts";
