// Public API of the circuit solver.

export { solveOperatingPoint, type DcOptions } from "./dc.js";
export { acSweep, findCorner, impedanceBetween, impedanceToGround, logSpace, transfer, type AcOptions } from "./ac.js";
export { diagnoseTopology, type TopologyProblem, type TopologyProblemKind } from "./diagnose.js";
export { seriesRlcAdmittance } from "./models/passive.js";
export { BJT_IGNORED, BJT_PARAMS } from "./models/bjt.js";
export { DIODE_IGNORED, DIODE_PARAMS } from "./models/diode.js";
export { JFET_IGNORED, JFET_PARAMS } from "./models/jfet.js";
export { DEFAULT_CHANNEL_SIZE, MOSFET_IGNORED, MOSFET_PARAMS } from "./models/mosfet.js";
export { THERMAL_VOLTAGE, ANALYSIS_TEMPERATURE } from "./models/junction.js";
export { unusedParams, type ParamSpec } from "./models/params.js";
export type {
  AcExcitation,
  AcResult,
  BjtOperatingPoint,
  BjtRegion,
  ComplexSeries,
  DeviceOperatingPoint,
  DiodeOperatingPoint,
  FetRegion,
  ImpedancePoint,
  JfetOperatingPoint,
  MosfetOperatingPoint,
  OperatingPoint,
  SolveMethod,
  TransferPoint,
} from "./types.js";
