// Public API of @wickstone/calc-core. Each calculator is also its own subpath
// (`@wickstone/calc-core/calculators/<id>`: its core, what computes) so a widget bundles only the
// one it shows; its texts (`calculators/<id>.texts`) follow after first paint.

export { VERSION } from './version.js';
export { formatValue, formatInput, parseNumber } from './format.js';
export { CalcInputError, type FieldIssue } from './errors.js';
export {
  conditionsHold,
  displayUnitOf,
  inputApplies,
  optionsFor,
  outputHelp,
  referencesFor,
  unitGap,
  unitSymbol,
  withUnit,
  type Displayable,
} from './display.js';
export {
  formatResult,
  headline,
  isSecondaryOutput,
  practicalDefault,
  readable,
  readableUnit,
  type Headline,
} from './answer.js';
export { inReaderUnits, readWarning, warningTitle, type ReadWarning } from './wording.js';

export {
  convert,
  converter,
  displayUnit,
  fromCanonical,
  fromCanonicalTo,
  getUnit,
  toCanonical,
  canonicalUnits,
  quantityKinds,
  STANDARD_GRAVITY,
  units,
  unitSystems,
  cgsUnits,
  type QuantityKind,
  type UnitDefinition,
  type UnitId,
  type UnitSystemId,
} from './units.js';

export {
  water,
  waterSurfaceTension,
  waterDensity,
  waterViscosity,
  iapws2008Viscosity,
  SURFACE_TENSION_RANGE_C,
  DENSITY_RANGE_C,
  VISCOSITY_RANGE_C,
  IAPWS2008_RANGE_K,
  type DensityFormulation,
  type WaterDensity,
} from './properties/water.js';
export {
  liquids,
  getLiquid,
  MERCURY_HAZARD,
  type Basis,
  type Liquid,
  type SourcedValue,
} from './properties/liquids.js';
export {
  contactAnglePresets,
  getContactAnglePreset,
  type ContactAnglePreset,
} from './properties/contactAngles.js';

export {
  jurinRise,
  slotRise,
  capillaryLength,
  meniscusCorrection,
  slotMeniscusCorrection,
  type RiseArgs,
} from './formulas/capillary.js';
export { laplacePressure, bubblePressure, poreEntryPressure } from './formulas/laplace.js';
export {
  wilhelmyForce,
  wilhelmySurfaceTension,
  wilhelmyRodForce,
  wilhelmyRodSurfaceTension,
  duNouySurfaceTension,
  platePerimeter,
  type RingResult,
} from './formulas/tensiometry.js';
export {
  hazenCapillaryRise,
  capillaryBreakCheck,
  HAZEN_C_RANGE_M2,
  type CapillaryBreakResult,
} from './formulas/soil.js';
export {
  washburnTime,
  washburnLength,
  gravityRestrainedRiseTime,
  type WashburnArgs,
} from './formulas/wicking.js';

export { canonicalJson, sha256Hex, type JsonValue } from './hash.js';
export { computeCalculation, computer, resolveInputs, resultsAgree } from './calculators/engine.js';
export { runCalculation, runner, hashInputs } from './calculators/run.js';
export { withTexts } from './join.js';
export {
  calculators,
  calculatorIds,
  getCalculator,
  calculate,
  compute,
  tubeRise as tubeRiseCalculator,
  slotRise as slotRiseCalculator,
  soilCapillaryRise as soilCapillaryRiseCalculator,
  interfacePressure as interfacePressureCalculator,
  wettingForce as wettingForceCalculator,
  wickingTime as wickingTimeCalculator,
  contactAngleFromForce as contactAngleFromForceCalculator,
  tensionFromRise as tensionFromRiseCalculator,
  risingDampHeight as risingDampHeightCalculator,
  frostScreening as frostScreeningCalculator,
  absorptionCoefficient as absorptionCoefficientCalculator,
  type CalculatorId,
} from './registry.js';
export {
  tableIssues,
  tableRows,
  tableField,
  parseTableField,
  cellName,
  showTable,
  tableSummary,
  rowsFromCells,
  plainInputs,
  type ShownTable,
  type TableWording,
} from './calculators/table.js';
export {
  absorptionPoints,
  fitLine,
  inFitWindow,
  FIT_WINDOW_S,
  type AbsorptionMethod,
  type LineFit,
} from './formulas/absorption.js';
export type {
  Band,
  BandBasis,
  CalculationResult,
  CalculatorCore,
  CalculatorDefinition,
  CalculatorTexts,
  Caution,
  ComputedResult,
  ChoiceInput,
  ChoiceOption,
  Condition,
  InputDefinition,
  InputValue,
  InputValues,
  OutputDefinition,
  Outputs,
  QuantityInput,
  Reference,
  Solution,
  Spread,
  TableColumn,
  TableInput,
  TableRow,
  Warning,
  WarningDefinition,
  WorkingStep,
} from './calculators/types.js';
