/** Field shapes and small checks shared by the HDR and appearance functions (not exported from the library). */
import type { FieldShape } from "../arguments/check-fields.ts";

/** ICtCp values. */
export const ICTCP_FIELDS: FieldShape = {
  what: "ICtCp values { I, Ct, Cp }",
  keys: ["I", "Ct", "Cp"],
};

/** Jzazbz values. */
export const JZAZBZ_FIELDS: FieldShape = {
  what: "Jzazbz values { Jz, az, bz }",
  keys: ["Jz", "az", "bz"],
};

/** CAM16-UCS values. */
export const UCS_FIELDS: FieldShape = {
  what: "CAM16-UCS values { J, a, b } (from cam16Ucs)",
  keys: ["J", "a", "b"],
};

/** Absolute tristimulus values in cd/m². */
export const ABSOLUTE_XYZ_FIELDS: FieldShape = {
  what: "absolute tristimulus values { X, Y, Z } in cd/m²",
  keys: ["X", "Y", "Z"],
};

/** BT.2100 linear RGB. */
export const LINEAR_RGB_FIELDS: FieldShape = {
  what: "BT.2100 linear RGB { r, g, b }",
  keys: ["r", "g", "b"],
};
