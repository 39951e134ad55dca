/** Barrel for lib/appearance (re-exports only): HDR colour (ICtCp, ΔE ITP, Jzazbz) and colour appearance (CAM16, CIECAM02, CAM16-UCS). */
export * from "./ictcp.ts";
export * from "./delta-e-itp.ts";
export * from "./jzazbz.ts";
export * from "./cam16.ts";
export * from "./cam16-ucs.ts";
