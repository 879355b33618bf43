// packages/calc-core/dist/version.js
/** The calc-core release; every result carries it so a logged run can be re-run on the same code. */
var VERSION = "0.2.0";
// packages/calc-core/dist/format.js
var SUPERSCRIPT$1 = "⁰¹²³⁴⁵⁶⁷⁸⁹";
/**
* A result figure for a person: `digits` significant figures, a true minus sign, powers of ten
* outside 0.001–999 999 (written ×10ⁿ, as the working is), grouping never (a thin space reads as
* two numbers in a narrow column).
*/
function formatValue(value, digits = 4) {
	if (!Number.isFinite(value)) return String(value);
	if (value === 0) return "0";
	const abs = Math.abs(value);
	const sign = value < 0 ? "−" : "";
	if (abs >= .001 && abs < 1e6) return sign + String(Number(abs.toPrecision(digits)));
	const [mantissa = "", exponent = ""] = abs.toExponential(digits - 1).split("e");
	const power = Number(exponent);
	const sup = [...String(Math.abs(power))].map((c) => SUPERSCRIPT$1[Number(c)] ?? c).join("");
	return `${sign}${String(Number(mantissa))}×10${power < 0 ? "⁻" : ""}${sup}`;
}
/**
* A number put into an input box: plain digits a person can edit (no ×10ⁿ, no unicode minus),
* six significant figures so a converted default such as 1 mm → 0.0393701 in stays readable.
*/
function formatInput(value) {
	if (!Number.isFinite(value)) return "";
	const rounded = Number(value.toPrecision(6));
	const text = String(rounded);
	if (!/e/i.test(text)) return text;
	const abs = Math.abs(rounded);
	if (abs >= 1e-9 && abs < 1e-6) return rounded.toFixed(5 - Math.floor(Math.log10(abs))).replace(/\.?0+$/, "");
	return text;
}
/**
* What a person typed, as a number: trims, accepts one comma as the decimal mark when there is no
* point (many visitors write 0,5), and a leading unicode minus. Empty → null; anything else
* unreadable → NaN, which calc-core reports as "must be a number".
*/
function parseNumber(text) {
	let t = text.trim().replace(/^[−–]/, "-");
	if (t === "") return null;
	if (!t.includes(".") && /^-?\d*,\d+$/.test(t)) t = t.replace(",", ".");
	if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return NaN;
	return Number(t);
}
// packages/calc-core/dist/errors.js
/**
* The one error type for bad arguments and bad calculator inputs.
*
* A formula function throws it with a single issue naming the argument; `calculate` throws it with
* every bad field at once, so a form can mark them all in one pass. `code` and `field` repeat the
* first issue so that callers that only care about one field need not look into `issues`.
*/
var CalcInputError = class extends Error {
	name = "CalcInputError";
	/** `INVALID_INPUTS` when several fields are bad, otherwise the single issue's code. */
	code;
	/** The first bad field or argument. */
	field;
	issues;
	constructor(issues) {
		const list = Array.isArray(issues) ? [...issues] : [issues];
		const first = list[0];
		if (first === void 0) throw new TypeError("CalcInputError needs at least one issue");
		super(list.length === 1 ? first.message : list.map((i) => `${i.field}: ${i.message}`).join("; "));
		this.code = list.length === 1 ? first.code : "INVALID_INPUTS";
		this.field = first.field;
		this.issues = list;
	}
	/** Plain data for an API error body: `{ code, message, issues }`. */
	toJSON() {
		return {
			code: this.code,
			message: this.message,
			issues: this.issues.map((i) => ({ ...i }))
		};
	}
};
// packages/calc-core/dist/guards.js
function fail(field, code, message) {
	throw new CalcInputError({
		field,
		code,
		message
	});
}
/** Throws unless `value` is a finite number. */
function finite(field, value) {
	if (typeof value !== "number" || Number.isNaN(value)) fail(field, "NOT_A_NUMBER", `${field} must be a number`);
	if (!Number.isFinite(value)) fail(field, "NOT_FINITE", `${field} must be finite`);
	return value;
}
/** Throws unless `value` is finite and greater than zero. */
function positive(field, value) {
	finite(field, value);
	if (value <= 0) fail(field, "NOT_POSITIVE", `${field} must be greater than zero`);
	return value;
}
/** Throws unless `value` is finite and not negative. */
function nonNegative(field, value) {
	finite(field, value);
	if (value < 0) fail(field, "NEGATIVE", `${field} must not be negative`);
	return value;
}
/** Throws unless `value` is greater than zero; `Infinity` is allowed (a flat direction). */
function positiveOrInfinite(field, value) {
	if (value === Infinity) return value;
	return positive(field, value);
}
/** Throws unless `value` is a contact angle in degrees, 0–180 inclusive. */
function contactAngle(field, value) {
	finite(field, value);
	if (value < 0 || value > 180) fail(field, "ANGLE_OUT_OF_RANGE", `${field} must be between 0° and 180°`);
	return value;
}
/**
* Throws a RangeError if a computed result is not finite. Finite arguments can still overflow
* (a bore of 1e-320 m), and a caller must never receive Infinity or NaN as an answer.
*/
function finiteResult(what, value) {
	if (!Number.isFinite(value)) throw new RangeError(`${what} is not a finite number for these arguments`);
	return value;
}
/**
* cos θ for θ in degrees, exact at 0°, 90° and 180°: Math.cos(π/2) is 6e-17, which would turn a
* zero rise into a tiny positive one and make a 90° angle look wetting.
*/
function cosDeg(angleDeg) {
	if (angleDeg === 90) return 0;
	if (angleDeg === 0) return 1;
	if (angleDeg === 180) return -1;
	return Math.cos(angleDeg * Math.PI / 180);
}
// packages/calc-core/dist/units.js
var quantityKinds = [
	"length",
	"area",
	"volume",
	"force",
	"pressure",
	"surfaceTension",
	"density",
	"temperature",
	"angle",
	"viscosity",
	"time",
	"acceleration",
	"sorptivity",
	"evaporationRate",
	"volumePerLength",
	"flowPerLength",
	"mass",
	"arealMass",
	"absorptionCoefficient",
	"dimensionless"
];
var INCH_M = .0254;
var FOOT_M = .3048;
var POUND_KG = .45359237;
/** Standard acceleration of gravity gₙ in m/s² (exact, CGPM 1901; NIST SP 811). */
var STANDARD_GRAVITY = 9.80665;
var POUND_FORCE_N = POUND_KG * STANDARD_GRAVITY;
var SQUARE_INCH_M2 = 64516e-8;
var SQUARE_FOOT_M2 = .09290304;
var CUBIC_FOOT_M3 = .028316846592;
/** US liquid gallon, 231 in³ exactly (NIST SP 811 B.8). */
var GALLON_M3 = 231 * INCH_M ** 3;
var DAY_S$1 = 86400;
function unit(kind, symbol, name, factor, offset = 0) {
	return {
		kind,
		symbol,
		name,
		factor,
		offset
	};
}
/**
* Every unit calc-core knows. The canonical unit of each kind (factor 1, offset 0) is the one
* `calculate` takes and returns: SI, except that angles are in degrees and temperatures in
* degrees Celsius, both accepted for use with the SI and the way every source here states them.
*/
var units = {
	m: unit("length", "m", "metre", 1),
	cm: unit("length", "cm", "centimetre", .01),
	mm: unit("length", "mm", "millimetre", .001),
	um: unit("length", "µm", "micrometre", 1e-6),
	nm: unit("length", "nm", "nanometre", 1e-9),
	in: unit("length", "in", "inch", INCH_M),
	ft: unit("length", "ft", "foot", FOOT_M),
	m2: unit("area", "m²", "square metre", 1),
	cm2: unit("area", "cm²", "square centimetre", 1e-4),
	mm2: unit("area", "mm²", "square millimetre", 1e-6),
	in2: unit("area", "in²", "square inch", SQUARE_INCH_M2),
	ft2: unit("area", "ft²", "square foot", SQUARE_FOOT_M2),
	m3: unit("volume", "m³", "cubic metre", 1),
	cm3: unit("volume", "cm³", "cubic centimetre", 1e-6),
	mm3: unit("volume", "mm³", "cubic millimetre", 1e-9),
	in3: unit("volume", "in³", "cubic inch", INCH_M ** 3),
	N: unit("force", "N", "newton", 1),
	mN: unit("force", "mN", "millinewton", .001),
	uN: unit("force", "µN", "micronewton", 1e-6),
	dyn: unit("force", "dyn", "dyne", 1e-5),
	lbf: unit("force", "lbf", "pound-force", POUND_FORCE_N),
	Pa: unit("pressure", "Pa", "pascal", 1),
	kPa: unit("pressure", "kPa", "kilopascal", 1e3),
	psi: unit("pressure", "psi", "pound-force per square inch", POUND_FORCE_N / SQUARE_INCH_M2),
	psf: unit("pressure", "psf", "pound-force per square foot", POUND_FORCE_N / SQUARE_FOOT_M2),
	inH2O: unit("pressure", "inH₂O", "inch of water (conventional)", 249.08891),
	"N/m": unit("surfaceTension", "N/m", "newton per metre", 1),
	"mN/m": unit("surfaceTension", "mN/m", "millinewton per metre", .001),
	"dyn/cm": unit("surfaceTension", "dyn/cm", "dyne per centimetre", .001),
	"lbf/ft": unit("surfaceTension", "lbf/ft", "pound-force per foot", POUND_FORCE_N / FOOT_M),
	"kg/m3": unit("density", "kg/m³", "kilogram per cubic metre", 1),
	"g/cm3": unit("density", "g/cm³", "gram per cubic centimetre", 1e3),
	"g/mL": unit("density", "g/mL", "gram per millilitre", 1e3),
	"lb/ft3": unit("density", "lb/ft³", "pound per cubic foot", POUND_KG / CUBIC_FOOT_M3),
	degC: unit("temperature", "°C", "degree Celsius", 1),
	degF: unit("temperature", "°F", "degree Fahrenheit", 1 / 1.8, -32),
	K: unit("temperature", "K", "kelvin", 1, -273.15),
	deg: unit("angle", "°", "degree", 1),
	rad: unit("angle", "rad", "radian", 180 / Math.PI),
	"Pa*s": unit("viscosity", "Pa·s", "pascal second", 1),
	"mPa*s": unit("viscosity", "mPa·s", "millipascal second", .001),
	cP: unit("viscosity", "cP", "centipoise", .001),
	s: unit("time", "s", "second", 1),
	min: unit("time", "min", "minute", 60),
	h: unit("time", "h", "hour", 3600),
	day: unit("time", "day", "day", 86400),
	"m/s2": unit("acceleration", "m/s²", "metre per second squared", 1),
	"ft/s2": unit("acceleration", "ft/s²", "foot per second squared", FOOT_M),
	"m/s^0.5": unit("sorptivity", "m/s½", "metre per root second", 1),
	"mm/s^0.5": unit("sorptivity", "mm/s½", "millimetre per root second", .001),
	"mm/min^0.5": unit("sorptivity", "mm/min½", "millimetre per root minute", .001 / Math.sqrt(60)),
	"in/h^0.5": unit("sorptivity", "in/h½", "inch per root hour", INCH_M / Math.sqrt(3600)),
	"m/s": unit("evaporationRate", "m/s", "metre per second", 1),
	"mm/day": unit("evaporationRate", "mm/day", "millimetre per day", .001 / DAY_S$1),
	"in/day": unit("evaporationRate", "in/day", "inch per day", INCH_M / DAY_S$1),
	"m3/m": unit("volumePerLength", "m³/m", "cubic metre per metre", 1),
	"L/m": unit("volumePerLength", "L/m", "litre per metre", .001),
	"gal/ft": unit("volumePerLength", "gal/ft", "US gallon per foot", GALLON_M3 / FOOT_M),
	"m3/(m*s)": unit("flowPerLength", "m³/(m·s)", "cubic metre per metre second", 1),
	"L/(m*day)": unit("flowPerLength", "L/(m·day)", "litre per metre day", .001 / DAY_S$1),
	"gal/(ft*day)": unit("flowPerLength", "gal/(ft·day)", "US gallon per foot day", GALLON_M3 / FOOT_M / DAY_S$1),
	kg: unit("mass", "kg", "kilogram", 1),
	g: unit("mass", "g", "gram", .001),
	lb: unit("mass", "lb", "pound", POUND_KG),
	"kg/m2": unit("arealMass", "kg/m²", "kilogram per square metre", 1),
	"lb/ft2": unit("arealMass", "lb/ft²", "pound per square foot", POUND_KG / SQUARE_FOOT_M2),
	"kg/(m2*s^0.5)": unit("absorptionCoefficient", "kg/(m²·√s)", "kilogram per square metre root second", 1),
	"kg/(m2*h^0.5)": unit("absorptionCoefficient", "kg/(m²·√h)", "kilogram per square metre root hour", 1 / 60),
	"lb/(ft2*h^0.5)": unit("absorptionCoefficient", "lb/(ft²·√h)", "pound per square foot root hour", POUND_KG / SQUARE_FOOT_M2 / 60),
	"in/min^0.5": unit("sorptivity", "in/√min", "inch per root minute", INCH_M / Math.sqrt(60)),
	"1": unit("dimensionless", "", "dimensionless", 1)
};
/** Spellings people type for a few units; mapped onto the ids above. */
var aliases = {
	µm: "um",
	"°C": "degC",
	"°F": "degF",
	"°": "deg",
	"Pa·s": "Pa*s",
	"mPa·s": "mPa*s",
	"m/s²": "m/s2",
	"ft/s²": "ft/s2"
};
/** The canonical (calculate-facing) unit of each kind. */
var canonicalUnits = {
	length: "m",
	area: "m2",
	volume: "m3",
	force: "N",
	pressure: "Pa",
	surfaceTension: "N/m",
	density: "kg/m3",
	temperature: "degC",
	angle: "deg",
	viscosity: "Pa*s",
	time: "s",
	acceleration: "m/s2",
	sorptivity: "m/s^0.5",
	evaporationRate: "m/s",
	volumePerLength: "m3/m",
	flowPerLength: "m3/(m*s)",
	mass: "kg",
	arealMass: "kg/m2",
	absorptionCoefficient: "kg/(m2*s^0.5)",
	dimensionless: "1"
};
/**
* The unit each kind is shown in by default. Surface tension has no US customary unit in use
* (lbf/ft gives numbers like 0.005): US laboratories report it in mN/m, so the US system does too.
* The dyne per centimetre, equal to it, is a CGS unit (see `cgsUnits`), not a US customary one.
* Viscosity stays in cP, equal to mPa·s, as US practice writes it.
*/
var unitSystems = {
	si: {
		length: "m",
		area: "cm2",
		volume: "cm3",
		force: "mN",
		pressure: "kPa",
		surfaceTension: "mN/m",
		density: "kg/m3",
		temperature: "degC",
		angle: "deg",
		viscosity: "mPa*s",
		time: "s",
		acceleration: "m/s2",
		sorptivity: "mm/min^0.5",
		evaporationRate: "mm/day",
		volumePerLength: "L/m",
		flowPerLength: "L/(m*day)",
		mass: "g",
		arealMass: "kg/m2",
		absorptionCoefficient: "kg/(m2*s^0.5)",
		dimensionless: "1"
	},
	us: {
		length: "in",
		area: "in2",
		volume: "in3",
		force: "lbf",
		pressure: "psi",
		surfaceTension: "mN/m",
		density: "lb/ft3",
		temperature: "degF",
		angle: "deg",
		viscosity: "cP",
		time: "s",
		acceleration: "ft/s2",
		sorptivity: "in/h^0.5",
		evaporationRate: "in/day",
		volumePerLength: "gal/ft",
		flowPerLength: "gal/(ft*day)",
		mass: "lb",
		arealMass: "lb/ft2",
		absorptionCoefficient: "lb/(ft2*h^0.5)",
		dimensionless: "1"
	}
};
/**
* Units of the centimetre–gram–second system that calc-core knows. Each equals an SI unit with a
* power of ten (1 dyn/cm = 1 mN/m, 1 cP = 1 mPa·s, 1 g/cm³ = 1000 kg/m³; NIST SP 811 B.8); a
* definition may offer one where its trade writes it, but no unit system shows them by default.
*/
var cgsUnits = [
	"dyn",
	"dyn/cm",
	"cP",
	"g/cm3"
];
/** Each unit's definition with its id, made once: lookups hand out these shared, frozen objects. */
var withIds = Object.fromEntries(Object.entries(units).map(([id, def]) => [id, Object.freeze({
	...def,
	id
})]));
/** The definition of a unit id or alias; throws CalcInputError (`UNKNOWN_UNIT`) for anything else. */
function getUnit(id, field = "unit") {
	const key = Object.hasOwn(units, id) ? id : aliases[id];
	if (key === void 0 || !Object.hasOwn(units, key)) throw new CalcInputError({
		field,
		code: "UNKNOWN_UNIT",
		message: `unknown unit "${id}"`
	});
	return withIds[key];
}
/** The display unit of a kind in a unit system. */
function displayUnit(kind, system) {
	return unitSystems[system][kind];
}
/**
* A conversion from one unit to another of the same kind, with both units looked up once: for
* converting many values (an export's column) without resolving the units again for each.
* Throws CalcInputError `UNIT_KIND_MISMATCH` across kinds and `UNKNOWN_UNIT` for an unknown id;
* the function it returns throws `NOT_A_NUMBER`/`NOT_FINITE` for a non-finite value.
*/
function converter(fromUnit, toUnit) {
	const from = getUnit(fromUnit, "fromUnit");
	const to = getUnit(toUnit, "toUnit");
	if (from.kind !== to.kind) throw new CalcInputError({
		field: "toUnit",
		code: "UNIT_KIND_MISMATCH",
		message: `cannot convert ${from.kind} (${from.symbol}) to ${to.kind} (${to.symbol})`
	});
	if (from.id === to.id) return (value) => finite("value", value);
	return (value) => (finite("value", value) + from.offset) * from.factor / to.factor - to.offset;
}
/**
* Converts `value` from one unit to another of the same kind (e.g. `convert(1, 'in', 'mm')` → 25.4).
* Throws CalcInputError `UNIT_KIND_MISMATCH` across kinds, `UNKNOWN_UNIT` for an unknown id and
* `NOT_A_NUMBER`/`NOT_FINITE` for a non-finite value.
*/
function convert(value, fromUnit, toUnit) {
	finite("value", value);
	return converter(fromUnit, toUnit)(value);
}
/** A value in a kind's canonical unit, from any unit of that kind. */
function toCanonical(value, fromUnit) {
	return convert(value, fromUnit, canonicalUnits[getUnit(fromUnit, "fromUnit").kind]);
}
/** A canonical value of a unit's kind, expressed in that unit. */
function fromCanonical(value, toUnit) {
	finite("value", value);
	return fromCanonicalTo(toUnit)(value);
}
/** `fromCanonical` with the unit looked up once, for converting many values into it. */
function fromCanonicalTo(toUnit) {
	return converter(canonicalUnits[getUnit(toUnit, "toUnit").kind], toUnit);
}
// packages/calc-core/dist/display.js
/** The unit a quantity is shown in: the definition's own choice for the system, else the system's unit for its kind. */
function displayUnitOf(item, system) {
	return item.display?.[system] ?? displayUnit(item.kind, system);
}
/**
* What stands between a number and a unit's symbol. SI Brochure (BIPM, 9th ed., 2019) §5.4.3 and
* NIST SP 811 (2008) §7.2: a space always separates the number from the unit, `20 °C` included;
* the one exception is the degree, minute and second of a plane angle, written against the number
* (`35°`). A pure number has no symbol and so nothing after it.
*/
function unitGap(unit) {
	const def = units[unit];
	return def.symbol === "" || def.kind === "angle" && def.symbol === "°" ? "" : " ";
}
/** The printed symbol of a unit (`mN/m`, `°C`, `kg/m³`; empty for a pure number). */
function unitSymbol(unit) {
	return units[unit].symbol;
}
/**
* A formatted number with its unit for reading: `12.5 mm`, `20 °C`, `35°`, `998.2 kg/m³`, `0.42`.
* @param text the number as already formatted (`formatValue`, `formatInput` or a range bound)
*/
function withUnit(text, unit) {
	return text + unitGap(unit) + unitSymbol(unit);
}
/**
* Whether an input takes part given the current choice values: every `appliesWhen` condition holds
* and the input it depends on takes part itself. A chain deeper than eight (only a definition
* that refers to itself) never applies.
* @param inputs the calculator's inputs, where the conditions' parents are looked up
* @param choices current values keyed by input id; only strings match a condition
*/
function inputApplies(input, inputs, choices, depth = 0) {
	if (depth >= 8) return false;
	return (input.appliesWhen ?? []).every((cond) => {
		const parent = inputs.find((i) => i.id === cond.input);
		const value = Object.hasOwn(choices, cond.input) ? choices[cond.input] : void 0;
		return parent !== void 0 && typeof value === "string" && cond.values.includes(value) && inputApplies(parent, inputs, choices, depth + 1);
	});
}
/** Whether every condition holds for these values (only strings match a condition). */
function conditionsHold(conditions, values) {
	return (conditions ?? []).every((cond) => {
		const value = Object.hasOwn(values, cond.input) ? values[cond.input] : void 0;
		return typeof value === "string" && cond.values.includes(value);
	});
}
/**
* The options of a choice offered for the current values: those whose conditions hold (a preset
* for another liquid is left out), then, when `allowed` is given (a firm's list), only those in it.
* @param values current values keyed by input id
*/
function optionsFor(input, values, allowed) {
	return input.options.filter((o) => conditionsHold(o.appliesWhen, values) && (allowed === void 0 || allowed.includes(o.value)));
}
/** The references that bear on a result: those whose conditions hold for the inputs it used. */
function referencesFor(references, inputs) {
	return references.filter((r) => conditionsHold(r.appliesWhen, inputs));
}
/** An output's help line for its value: the sign-dependent help when it has one, else its fixed help. */
function outputHelp(output, value) {
	if (output.helpBySign !== void 0 && value !== null) return value > 0 ? output.helpBySign.above : output.helpBySign.atOrBelow;
	return output.help;
}
// packages/calc-core/dist/answer.js
/**
* A result figure: `digits` significant figures (3 unless asked), a true minus sign, written out in
* full (no ×10ⁿ) from 10⁻⁶ up to 10⁹, which every figure in a well-chosen unit falls within.
*/
function formatResult(value, digits = 3) {
	if (!Number.isFinite(value)) return String(value);
	if (value === 0) return "0";
	const abs = Math.abs(value);
	const sign = value < 0 ? "−" : "";
	const rounded = Number(abs.toPrecision(digits));
	if (rounded >= 1e-6 && rounded < 1e9) {
		const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(rounded)));
		return sign + rounded.toFixed(Math.min(decimals, 20)).replace(/(\.\d*?)0+$/, "$1").replace(/\.$/, "");
	}
	return formatValue(value, digits);
}
/** Significant figures of a number as JavaScript prints it (0.15 → 2, 9.80665 → 6, 1000 → 1). */
function significantFigures(value) {
	if (!Number.isFinite(value) || value === 0) return 1;
	const digits = Number(Math.abs(value).toPrecision(15)).toExponential().split("e")[0]?.replace(".", "");
	return Math.max(1, (digits ?? "").length);
}
/**
* How a default is written in the box after conversion into another unit. A round default stays
* round in the new unit, as an engineer would write it (1 m → 3.3 ft, 0.15 m → 6 in, 0.1 mm →
* 0.004 in): the fewest significant figures, one to three, within 2 % of the exact conversion
* (our threshold). A default that is not round (standard gravity, 9.80665 m/s²) keeps six
* figures, so nothing exact is blurred.
* @param displayValue the default converted into the unit shown
* @param canonicalDefault the default as defined, canonical units (its roundness decides)
*/
function practicalDefault(displayValue, canonicalDefault) {
	if (!Number.isFinite(displayValue)) return "";
	if (significantFigures(canonicalDefault) > 2) return formatInput(displayValue);
	for (let n = 1; n <= 3; n++) {
		const r = Number(displayValue.toPrecision(n));
		if (displayValue === 0 || Math.abs(r - displayValue) <= .02 * Math.abs(displayValue)) return formatInput(r);
	}
	return formatInput(displayValue);
}
/**
* The unit a quantity reads best in for a sentence: lengths by size (0.02 mm, 30 mm, 1.5 m;
* 0.004 in, 6 in, 3.3 ft), everything else the system's unit for its kind.
* @param canonicalValue the value in its kind's canonical unit (m for a length)
*/
function readableUnit(kind, system, canonicalValue) {
	if (kind !== "length") return displayUnit(kind, system);
	const abs = Math.abs(canonicalValue);
	if (system === "us") return abs >= .3048 ? "ft" : "in";
	return abs >= 1 ? "m" : "mm";
}
/** A canonical value with its unit for a sentence: `29.7 mm`, `1.17 in`, `0.5 m`. */
function readable(canonicalValue, kind, system, unit = readableUnit(kind, system, canonicalValue)) {
	return withUnit(formatResult(convert(canonicalValue, canonicalUnitOf(kind), unit)), unit);
}
/** The canonical unit of a kind (factor 1, no offset): `m`, `N/m`, `°C`. */
function canonicalUnitOf(kind) {
	return Object.keys(units).find((id) => {
		const u = units[id];
		return u.kind === kind && u.factor === 1 && u.offset === 0;
	}) ?? "1";
}
/** A value of one of the calculator's inputs or outputs, in the unit its definition shows it in; a time in words. */
function shown(def, id, value, system) {
	const item = [...def.outputs, ...def.inputs].find((x) => x.id === id);
	if (item === void 0 || item.kind === "choice" || item.kind === "table") return formatResult(value);
	if (item.kind === "time") return durationText(value);
	const unit = item.display?.[system];
	return readable(value, item.kind, system, unit ?? readableUnit(item.kind, system, value));
}
function durationText(seconds) {
	for (const [unit, from, word] of [
		[
			"day",
			172800,
			"days"
		],
		[
			"h",
			7200,
			"hours"
		],
		[
			"min",
			120,
			"minutes"
		]
	]) if (seconds >= from) return `${formatResult(convert(seconds, "s", unit))} ${word}`;
	return `${formatResult(seconds)} ${seconds === 1 ? "second" : "seconds"}`;
}
/** The chosen liquid in words: `Water`, `Mercury`, or `The liquid` for one entered by hand. */
function liquidName(def, r) {
	const id = r.inputs.liquid;
	const input = def.inputs.find((i) => i.id === "liquid");
	return (input?.kind === "choice" && id !== "custom" ? input.options.find((o) => o.value === id)?.label : void 0) ?? "The liquid";
}
function fill(template, def, r, value, system, output) {
	return template.replace(/\{(value|liquid|input\.(\w+))\}/g, (_, what, input) => {
		if (what === "liquid") return liquidName(def, r);
		if (input === void 0) return shown(def, output, Math.abs(value), system);
		const v = r.inputs[input];
		return typeof v === "number" ? shown(def, input, v, system) : String(v);
	});
}
/**
* The headline of a result: one plain sentence in the reader's unit system that answers the
* calculator's question (its `headline` rules), or says why no figure is given (the general
* statement of the warning that withholds it). A calculator without rules gets its first output
* with a figure as a sentence, so one added later still has a headline.
*/
function headline(def, r, system) {
	const applying = (def.headline?.rules ?? def.outputs.map((o) => ({
		output: o.id,
		text: `${o.label}: about {value}.`
	}))).filter((rule) => conditionsHold(rule.when, r.inputs) && (rule.warning === void 0 || r.warnings.some((w) => w.code === rule.warning)));
	for (const rule of applying) {
		const value = r.outputs[rule.output];
		if (typeof value !== "number") continue;
		return {
			text: fill(value <= 0 && rule.atOrBelow !== void 0 ? rule.atOrBelow : rule.text, def, r, value, system, rule.output),
			output: rule.output,
			withheld: false
		};
	}
	const first = applying[0]?.output ?? def.outputs[0]?.id;
	const w = r.warnings.find((x) => first !== void 0 && (x.withholds ?? []).includes(first));
	const why = w === void 0 ? void 0 : def.warnings.find((d) => d.code === w.code)?.summary;
	return {
		text: `No ${def.headline?.missing ?? "figure"} is given for these inputs.${why === void 0 ? "" : ` ${why}`}`,
		output: null,
		withheld: true
	};
}
/**
* Outputs that back the headline up rather than answer the question (capillary length,
* dimensionless ratios): shown folded under the working, and a firm may hide them.
*/
function isSecondaryOutput(output) {
	return output.kind === "dimensionless" || output.id === "capillaryLength";
}
// packages/calc-core/dist/wording.js
var CANONICAL_SYMBOLS = [
	["m/s²", "acceleration"],
	["kg/m³", "density"],
	["N/m", "surfaceTension"],
	["Pa·s", "viscosity"],
	["m²", "area"],
	["m³", "volume"],
	["°C", "temperature"],
	["Pa", "pressure"],
	["N", "force"],
	["m", "length"]
];
var SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
var NUMBER = String.raw`(−?\d+(?:\.\d+)?(?:×10⁻?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)?)`;
var QUANTITY = new RegExp(`${NUMBER} (${CANONICAL_SYMBOLS.map(([s]) => s.replace(/[/.*+?^${}()|[\]\\]/g, "\\$&")).join("|")})(?![\\w/²³·])`, "g");
function readNumber(text) {
	const [mantissa = "", power] = text.replace("−", "-").split("×10");
	if (power === void 0) return Number(mantissa);
	const exp = [...power].map((c) => c === "⁻" ? "-" : String(SUPERSCRIPT_DIGITS.indexOf(c))).join("");
	return Number(mantissa) * 10 ** Number(exp);
}
/**
* A calc-core sentence re-stated in a reader's units: every value printed in a canonical SI unit
* (`0.00002 m`, `2×10⁻⁵ m`, `0.002726 m`, `20 °C`) becomes the readable unit of the system
* (`0.02 mm`, `2.73 mm`; `0.0000787 in`, `68 °F`). Values already in a chosen unit (`4 in`,
* `0.075 mm`) and pure numbers are left as written.
*/
function inReaderUnits(text, system) {
	return text.replace(QUANTITY, (whole, num, symbol) => {
		const kind = CANONICAL_SYMBOLS.find(([s]) => s === symbol)?.[1];
		const value = readNumber(num);
		if (kind === void 0 || !Number.isFinite(value)) return whole;
		return readable(value, kind, system);
	});
}
/** A plain title for each warning code calc-core raises; codes stay in data and the dashboard. */
var WARNING_TITLES = {
	BORE_TOO_WIDE: "Bore too wide for this formula",
	GAP_TOO_WIDE: "Gap too wide for this formula",
	BORE_NOT_SMALL: "Wide bore: read the corrected rise",
	GAP_NOT_SMALL: "Wide gap: read the corrected rise",
	CONTACT_ANGLE_NEAR_90: "Contact angle close to 90°",
	MENISCUS_CORRECTION_NOT_APPLIED: "Convex meniscus: no correction",
	CAPILLARY_RISE_REACHES_SLAB: "Capillary water reaches the slab",
	CAPILLARY_RISE_MAY_REACH_SLAB: "The margin under the slab is not secure",
	LAYER_THINNER_THAN_CODE_MINIMUM: "Layer thinner than the code minimum",
	LAYER_NOT_CLEAN_GRAVEL: "Layer too fine to be clean gravel",
	WATER_TABLE_IN_LAYER: "Water table inside the layer",
	FINE_GRAINED_SOIL: "Soil too fine for Hazen's formula",
	SHAPE_NOT_SPHERICAL: "Too large to stay round",
	PORE_NON_WETTING: "The liquid does not wet the pore",
	CONTACT_ANGLE_NOT_ZERO: "The probe is not fully wetted",
	RING_BELOW_ASTM_SIZE: "Ring smaller than the standard ring",
	RING_OUTSIDE_CORRECTION_RANGE: "Ring outside its correction tables",
	RING_FACTOR_OUTSIDE_TABLES: "Correction factor outside its tables",
	DENSITY_DIFFERENCE_IMPLAUSIBLE: "Unlikely density difference",
	BEYOND_JURIN_LIMIT: "Higher than the liquid can climb",
	INERTIA_NOT_NEGLIGIBLE: "Too quick to ignore inertia",
	PORE_TOO_WIDE: "Pore too wide for this formula",
	GRAVITY_NOT_NEGLIGIBLE: "Gravity slows the rise"
};
/**
* A warning's title. A code this module does not know (a calculator added later) gets the
* summary its calculator declares, cut at the first colon, or else a general title.
*/
function warningTitle(code, def) {
	const known = Object.hasOwn(WARNING_TITLES, code) ? WARNING_TITLES[code] : void 0;
	if (known !== void 0) return known;
	const summary = def?.warnings.find((w) => w.code === code)?.summary;
	if (summary !== void 0 && summary !== "") return (summary.split(/[:;]/)[0] ?? summary).replace(/\.$/, "");
	return "Check this result";
}
/** The title and the sentence of a warning, its values re-stated in `system`'s units. */
function readWarning(warning, system, def) {
	return {
		code: warning.code,
		title: warningTitle(warning.code, def),
		text: inReaderUnits(warning.message, system)
	};
}
// packages/calc-core/dist/properties/water.js
var KELVIN_OFFSET = 273.15;
function checkRange(what, tC, minC, maxC) {
	finite("temperatureC", tC);
	if (tC < minC || tC > maxC) throw new RangeError(`${what}: ${tC} °C is outside its range of ${minC}–${maxC} °C`);
}
/** IAPWS R1-76(2014) constants: B in N/m, b and μ dimensionless, Tc in K. */
var IAPWS_R1_76 = {
	B: .2358,
	b: -.625,
	mu: 1.256,
	Tc: 647.096
};
var IAPWS_TC_K = IAPWS_R1_76.Tc;
/** Triple point 273.16 K and critical point 647.096 K, in °C: the range IAPWS R1-76 states. */
var SURFACE_TENSION_RANGE_C = {
	min: .01,
	max: IAPWS_TC_K - KELVIN_OFFSET
};
/**
* Surface tension of water against its vapour (≈ air), IAPWS R1-76(2014).
* @param tC temperature in °C, 0.01–373.946 (triple point to critical point)
* @returns surface tension in N/m
* @throws RangeError outside 0.01–373.946 °C
*/
function waterSurfaceTension(tC) {
	checkRange("water surface tension (IAPWS R1-76)", tC, SURFACE_TENSION_RANGE_C.min, SURFACE_TENSION_RANGE_C.max);
	const tau = 1 - (tC + KELVIN_OFFSET) / IAPWS_TC_K;
	if (tau <= 0) return 0;
	return IAPWS_R1_76.B * tau ** IAPWS_R1_76.mu * (1 + IAPWS_R1_76.b * tau);
}
var DENSITY_RANGE_C = {
	min: 0,
	max: 150
};
/** Tanaka et al. 2001 eq. (1) coefficients: a1, a2, a4 in °C, a3 in °C², a5 in kg/m³. */
var TANAKA_2001 = {
	a1: -3.983035,
	a2: 301.797,
	a3: 522528.9,
	a4: 69.34881,
	a5: 999.97495
};
/** Kell 1975: numerator coefficients of t⁰…t⁵ (kg/m³ per °Cⁿ) and the denominator's b (1/°C). */
var KELL_1975 = {
	a: [
		999.83952,
		16.945176,
		-.0079870401,
		-46170461e-12,
		1.0556302e-7,
		-28054253e-17
	],
	b: .01687985
};
/** IAPWS SR6-08 (2011) liquid water at 0.1 MPa: μ/(μPa·s) = Σ aᵢ·(T/T*)^bᵢ, T* = 300 K. */
var IAPWS_SR6_08 = {
	a: [
		280.68,
		511.45,
		61.131,
		.45903
	],
	b: [
		-1.9,
		-7.7,
		-19.6,
		-40
	],
	Tstar: 300
};
/**
* Density of air-free water at atmospheric pressure: Tanaka et al. 2001 from 0 to 40 °C (the
* metrology standard), Kell 1975 above 40 °C up to 150 °C. The two agree within 0.0033 kg/m³ where
* they overlap, so the switch at 40 °C leaves no step worth the name.
* @param tC temperature in °C, 0–150
* @returns density in kg/m³ with the formulation used and its source
* @throws RangeError outside 0–150 °C
*/
function waterDensity(tC) {
	checkRange("water density (Tanaka 2001 / Kell 1975)", tC, DENSITY_RANGE_C.min, DENSITY_RANGE_C.max);
	if (tC <= 40) {
		const { a1, a2, a3, a4, a5 } = TANAKA_2001;
		return {
			value: a5 * (1 - (tC + a1) ** 2 * (tC + a2) / (a3 * (tC + a4))),
			formulation: "tanaka-2001",
			source: "Tanaka et al. 2001"
		};
	}
	const t = tC;
	let numerator = 0;
	KELL_1975.a.forEach((a, n) => {
		numerator += a * t ** n;
	});
	return {
		value: numerator / (1 + KELL_1975.b * t),
		formulation: "kell-1975",
		source: "Kell 1975"
	};
}
/** 253.15–383.15 K in °C: the range of IAPWS SR6-08 for liquid water at 0.1 MPa (incl. metastable states). */
var VISCOSITY_RANGE_C = {
	min: -20,
	max: 110
};
/**
* Dynamic viscosity of liquid water at 0.1 MPa, IAPWS SR6-08 (2011) "Supplementary Release on
* Properties of Liquid Water at 0.1 MPa": μ/(μPa·s) = Σ aᵢ (T/300 K)^bᵢ. It stays within 0.0032 %
* of the full IAPWS 2008 formulation over 0–99 °C (see `iapws2008Viscosity`).
* @param tC temperature in °C, −20 to 110
* @returns viscosity in Pa·s
* @throws RangeError outside −20 to 110 °C
*/
function waterViscosity(tC) {
	checkRange("water viscosity (IAPWS SR6-08)", tC, VISCOSITY_RANGE_C.min, VISCOSITY_RANGE_C.max);
	const tr = (tC + KELVIN_OFFSET) / IAPWS_SR6_08.Tstar;
	let micro = 0;
	IAPWS_SR6_08.a.forEach((a, i) => {
		micro += a * tr ** (IAPWS_SR6_08.b[i] ?? 0);
	});
	return micro * 1e-6;
}
var H0 = [
	1.67752,
	2.20462,
	.6366564,
	-.241605
];
var H1 = [
	[
		.520094,
		.222531,
		-.281378,
		.161913,
		-.0325372,
		0,
		0
	],
	[
		.0850895,
		.999115,
		-.906851,
		.257399,
		0,
		0,
		0
	],
	[
		-1.08374,
		1.88797,
		-.772479,
		0,
		0,
		0,
		0
	],
	[
		-.289555,
		1.26613,
		-.489837,
		0,
		.0698452,
		0,
		-.00435673
	],
	[
		0,
		0,
		-.25704,
		0,
		0,
		.00872102,
		0
	],
	[
		0,
		.120573,
		0,
		0,
		0,
		0,
		-593264e-9
	]
];
/** 253.15–1173.15 K: the temperature span of IAPWS 2008 (its lower edge follows the melting curve). */
var IAPWS2008_RANGE_K = {
	min: 253.15,
	max: 1173.15
};
/**
* Viscosity of water at a given density and temperature, IAPWS 2008 without the critical
* enhancement. Use it when the density is known (e.g. from IAPWS-95); `waterViscosity` is the
* 0.1 MPa shortcut.
* @param args.density density in kg/m³ (> 0)
* @param args.temperatureK temperature in K, 253.15–1173.15
* @returns viscosity in Pa·s
*/
function iapws2008Viscosity(args) {
	const rho = positive("density", args.density);
	const tK = finite("temperatureK", args.temperatureK);
	if (tK < IAPWS2008_RANGE_K.min || tK > IAPWS2008_RANGE_K.max) throw new RangeError(`water viscosity (IAPWS 2008): ${tK} K is outside its range of ${IAPWS2008_RANGE_K.min}–${IAPWS2008_RANGE_K.max} K`);
	const tr = tK / 647.096;
	const rr = rho / 322;
	let sum0 = 0;
	for (let i = 0; i < H0.length; i++) sum0 += (H0[i] ?? 0) / tr ** i;
	const mu0 = 100 * Math.sqrt(tr) / sum0;
	let outer = 0;
	for (let i = 0; i < H1.length; i++) {
		const row = H1[i] ?? [];
		let inner = 0;
		for (let j = 0; j < row.length; j++) inner += (row[j] ?? 0) * (rr - 1) ** j;
		outer += (1 / tr - 1) ** i * inner;
	}
	return mu0 * Math.exp(rr * outer) * 1e-6;
}
/** The water correlations as one object: `water.surfaceTension(20)` and so on. */
var water = {
	surfaceTension: waterSurfaceTension,
	density: waterDensity,
	viscosity: waterViscosity
};
// packages/calc-core/dist/properties/liquids.js
/**
* Harmonised classifications of Regulation (EC) No 1272/2008 (CLP) Annex VI as the ECHA C&L
* inventory lists them, or the supplier safety data sheet where there is none; recalled, not read
* from the inventory here, so every line says `from memory` until someone checks it.
*/
var CLP_SOURCE = "Regulation (EC) No 1272/2008 (CLP) Annex VI, as listed in the ECHA C&L inventory";
var SDS_SOURCE = "supplier safety data sheets (self-classification under CLP)";
function hazard(code, text, source) {
	return {
		code,
		text,
		source,
		basis: "from memory"
	};
}
/** Shown with every result that involves mercury. */
var MERCURY_HAZARD = "Mercury is toxic: its vapour is harmful at room temperature and spills are hard to clean up. GHS: Acute Tox. 2 by inhalation (H330), Repr. 1B (H360D), STOT RE 1 (H372), Aquatic Acute 1 and Chronic 1 (H400, H410). Handle it only under the controls its safety data sheet and local rules require.";
var JASPER = "Jasper J. J. (1972) J. Phys. Chem. Ref. Data 1, 841–1009";
var CRC = "CRC Handbook of Chemistry and Physics, tables of liquid density and viscosity";
function printed(value, source) {
	return {
		value,
		source,
		basis: "printed"
	};
}
function recalled(value, source) {
	return {
		value,
		source,
		basis: "from memory"
	};
}
/**
* Liquids other than water, at 20 °C (water has its own temperature correlations in `water`).
* Surface tensions are Jasper's printed values except glycerol; densities and viscosities are
* handbook values marked `from memory` until someone checks them against the printed page.
*/
var liquids = [
	{
		id: "ethanol",
		name: "Ethanol",
		temperatureC: 20,
		surfaceTension: printed(.02239, JASPER),
		density: recalled(789.3, CRC),
		viscosity: recalled(.0012, CRC),
		hazard: hazard("HAZARD_ETHANOL", "Ethanol is highly flammable: keep it away from flames, sparks and hot surfaces. GHS: Flam. Liq. 2 (H225); Eye Irrit. 2 (H319) on most supplier sheets.", `${CLP_SOURCE}; ${SDS_SOURCE} for H319`)
	},
	{
		id: "methanol",
		name: "Methanol",
		temperatureC: 20,
		surfaceTension: printed(.02245, JASPER),
		density: recalled(791.4, CRC),
		viscosity: recalled(59e-5, CRC),
		hazard: hazard("HAZARD_METHANOL", "Methanol is highly flammable and toxic if swallowed, inhaled or absorbed through the skin; it damages the optic nerve. GHS: Flam. Liq. 2 (H225), Acute Tox. 3 oral, dermal and inhalation (H301, H311, H331), STOT SE 1 (H370).", CLP_SOURCE)
	},
	{
		id: "acetone",
		name: "Acetone",
		temperatureC: 20,
		surfaceTension: printed(.02402, JASPER),
		density: recalled(790, CRC),
		viscosity: recalled(32e-5, CRC),
		hazard: hazard("HAZARD_ACETONE", "Acetone is highly flammable and its vapour causes drowsiness. GHS: Flam. Liq. 2 (H225), Eye Irrit. 2 (H319), STOT SE 3 (H336); EUH066 (repeated exposure may cause skin dryness or cracking).", CLP_SOURCE)
	},
	{
		id: "toluene",
		name: "Toluene",
		temperatureC: 20,
		surfaceTension: printed(.02852, JASPER),
		density: recalled(866.9, CRC),
		viscosity: recalled(59e-5, CRC),
		hazard: hazard("HAZARD_TOLUENE", "Toluene is highly flammable, may be fatal if swallowed and enters the airways, and is suspected of damaging the unborn child. GHS: Flam. Liq. 2 (H225), Asp. Tox. 1 (H304), Skin Irrit. 2 (H315), STOT SE 3 (H336), Repr. 2 (H361d), STOT RE 2 (H373).", CLP_SOURCE)
	},
	{
		id: "ethylene-glycol",
		name: "Ethylene glycol",
		temperatureC: 20,
		surfaceTension: printed(.04843, JASPER),
		density: recalled(1113.5, CRC),
		viscosity: recalled(.0199, CRC),
		hazard: hazard("HAZARD_ETHYLENE_GLYCOL", "Ethylene glycol is harmful if swallowed and damages the kidneys on repeated exposure; it tastes sweet, so keep it from children and animals. GHS: Acute Tox. 4 oral (H302), STOT RE 2 (H373).", CLP_SOURCE)
	},
	{
		id: "glycerol",
		name: "Glycerol",
		temperatureC: 20,
		surfaceTension: recalled(.0634, "handbook value for glycerol at 20 °C"),
		density: recalled(1261, CRC),
		viscosity: recalled(1.41, CRC)
	},
	{
		id: "mercury",
		name: "Mercury",
		temperatureC: 20,
		surfaceTension: printed(.4865, "Adamson A. W., Gast A. P. (1997) Physical Chemistry of Surfaces, 6th ed., Wiley"),
		density: recalled(13546, CRC),
		viscosity: recalled(.00155, CRC),
		hazard: hazard("HAZARD_MERCURY", MERCURY_HAZARD, CLP_SOURCE)
	}
];
/** A liquid row by id, or undefined. */
function getLiquid(id) {
	return liquids.find((l) => l.id === id);
}
// packages/calc-core/dist/properties/contactAngles.js
/**
* Contact-angle presets a widget can offer instead of a typed angle. Angles depend strongly on
* cleanliness and on whether the meniscus is advancing or receding; the spread is what the band of
* a result is drawn from.
*/
var contactAnglePresets = [
	{
		id: "water-clean-glass",
		label: "Water on clean glass",
		liquid: "water",
		surface: "clean glass",
		angleDeg: 0,
		source: "water wets clean glass at about 0°",
		basis: "common practice"
	},
	{
		id: "water-mineral-grains",
		label: "Water on clean mineral grains (sand, silt)",
		liquid: "water",
		surface: "clean quartz-rich mineral grains",
		angleDeg: 0,
		source: "soil capillarity is worked with full wetting, θ = 0°, unless the soil is water-repellent",
		basis: "common practice"
	},
	{
		id: "water-roughened-platinum",
		label: "Water on a roughened platinum plate",
		liquid: "water",
		surface: "roughened platinum (Wilhelmy plate)",
		angleDeg: 0,
		source: "a clean roughened platinum plate is taken as fully wetted, θ = 0°",
		basis: "common practice"
	},
	{
		id: "mercury-glass",
		label: "Mercury on glass",
		liquid: "mercury",
		surface: "glass",
		angleDeg: 140,
		spreadDeg: {
			low: 130,
			high: 140
		},
		source: "mercury on glass sits near 130–140°, with 140° the usual default",
		basis: "common practice"
	}
];
/** A preset by id, or undefined. */
function getContactAnglePreset(id) {
	return contactAnglePresets.find((p) => p.id === id);
}
// packages/calc-core/dist/formulas/capillary.js
function common(args) {
	return {
		sigma: positive("surfaceTension", args.surfaceTension),
		cos: cosDeg(contactAngle("contactAngleDeg", args.contactAngleDeg)),
		rho: positive("density", args.density),
		g: positive("gravity", args.gravity ?? 9.80665)
	};
}
/**
* Jurin's law, h = 4σ·cos θ / (ρ·g·d): equilibrium height of the bottom of the meniscus above the
* free surface, for a bore that is small against the capillary length.
* @param args.diameter bore diameter in m
* @returns rise in m; negative for a depression (θ > 90°)
*/
function jurinRise(args) {
	const { sigma, cos, rho, g } = common(args);
	const d = positive("diameter", args.diameter);
	return finiteResult("capillary rise", 4 * sigma * cos / (rho * g * d));
}
/**
* Rise between two parallel walls a gap w apart, h = 2σ·cos θ / (ρ·g·w): the force balance of
* Jurin's law per unit length of a slot, half the rise of a tube whose diameter equals the gap.
* @param args.gap distance between the walls in m
* @returns rise in m; negative for a depression
*/
function slotRise(args) {
	const { sigma, cos, rho, g } = common(args);
	const w = positive("gap", args.gap);
	return finiteResult("capillary rise", 2 * sigma * cos / (rho * g * w));
}
/**
* Capillary length ℓc = √(σ / (ρ·g)): a bore is "small" when its radius is well below it.
* @param args.surfaceTension N/m
* @param args.density kg/m³
* @param args.gravity m/s², standard gravity when absent
* @returns capillary length in m
*/
function capillaryLength(args) {
	const sigma = positive("surfaceTension", args.surfaceTension);
	const rho = positive("density", args.density);
	const g = positive("gravity", args.gravity ?? 9.80665);
	return finiteResult("capillary length", Math.sqrt(sigma / (rho * g)));
}
function wettingAngle(angleDeg) {
	contactAngle("contactAngleDeg", angleDeg);
	if (angleDeg > 90) throw new CalcInputError({
		field: "contactAngleDeg",
		code: "MENISCUS_NOT_CONCAVE",
		message: "the meniscus-weight correction is for a wetting (concave) meniscus, θ ≤ 90°"
	});
	return angleDeg;
}
/**
* Meniscus-weight correction for a tube: the height of the liquid held in the meniscus above its
* lowest point, spread over the bore, so that Jurin's rise minus it is the rise to the bottom of
* the meniscus. For θ = 0 (a hemisphere) it is Rayleigh's r/3 (Rayleigh 1915, Proc. R. Soc. A 92,
* 184: σ = ρ·g·r·(h + r/3) / (2 cos θ)); for 0 < θ ≤ 90° the same spherical-cap geometry with radius
* r/cos θ, derived here. Only the first term of Rayleigh's series: good while r ≪ ℓc.
* @param args.diameter bore diameter in m
* @param args.contactAngleDeg degrees, 0–90
* @returns correction in m (≥ 0)
*/
function meniscusCorrection(args) {
	return meniscusGeometry(args).correction;
}
/** The tube's meniscus correction with its intermediate values (see `meniscusCorrection`). */
function meniscusGeometry(args) {
	const r = positive("diameter", args.diameter) / 2;
	const angle = wettingAngle(args.contactAngleDeg);
	if (angle === 90) return {
		radius: Infinity,
		sag: 0,
		held: 0,
		correction: 0
	};
	const R = r / cosDeg(angle);
	const sag = R * (1 - Math.sin(angle * Math.PI / 180));
	const capVolume = Math.PI * sag * sag * (3 * R - sag) / 3;
	return {
		radius: R,
		sag,
		held: Math.PI * r * r * sag - capVolume,
		correction: sag - capVolume / (Math.PI * r * r)
	};
}
/**
* The slot form of the meniscus-weight correction: a cylindrical meniscus of radius (w/2)/cos θ,
* liquid above its lowest point spread over the gap; (1/2 − π/8)·w at θ = 0. The two-dimensional
* analogue of Rayleigh's r/3, derived here from the same geometry.
* @param args.gap distance between the walls in m
* @param args.contactAngleDeg degrees, 0–90
* @returns correction in m (≥ 0)
*/
function slotMeniscusCorrection(args) {
	return slotMeniscusGeometry(args).correction;
}
/** The slot's meniscus correction with its intermediate values (see `slotMeniscusCorrection`). */
function slotMeniscusGeometry(args) {
	const w = positive("gap", args.gap);
	const angle = wettingAngle(args.contactAngleDeg);
	if (angle === 90) return {
		radius: Infinity,
		sag: 0,
		held: 0,
		correction: 0
	};
	const R = w / 2 / cosDeg(angle);
	const sag = R * (1 - Math.sin(angle * Math.PI / 180));
	const half = Math.PI / 2 - angle * Math.PI / 180;
	const segment = R * R * (half - Math.sin(half) * Math.cos(half));
	return {
		radius: R,
		sag,
		held: w * sag - segment,
		correction: sag - segment / w
	};
}
// packages/calc-core/dist/formulas/laplace.js
/**
* Young–Laplace equation, Δp = σ·(1/R₁ + 1/R₂): pressure on the concave side of a surface with
* principal radii R₁, R₂.
* @param args.surfaceTension N/m
* @param args.r1 first principal radius in m
* @param args.r2 second principal radius in m; r1 when absent (sphere), Infinity for a cylinder
* @returns pressure difference in Pa
*/
function laplacePressure(args) {
	const sigma = positive("surfaceTension", args.surfaceTension);
	const r1 = positive("r1", args.r1);
	const r2 = positiveOrInfinite("r2", args.r2 ?? r1);
	return finiteResult("Laplace pressure", sigma * (1 / r1 + 1 / r2));
}
/**
* Excess pressure in a bubble of thin film with two surfaces (a soap bubble), Δp = 4σ/R. A gas
* bubble inside a liquid has one surface: use `laplacePressure` (2σ/R).
* @param args.surfaceTension N/m
* @param args.radius bubble radius in m
* @returns pressure difference in Pa
*/
function bubblePressure(args) {
	const sigma = positive("surfaceTension", args.surfaceTension);
	const r = positive("radius", args.radius);
	return finiteResult("bubble pressure", 4 * sigma / r);
}
/**
* Capillary (air-entry) pressure of a cylindrical pore, Pc = 2σ·cos θ / r: the suction the
* meniscus holds, or for θ > 90° (negative result) the pressure needed to push the liquid in.
* @param args.surfaceTension N/m
* @param args.contactAngleDeg degrees, 0–180
* @param args.poreRadius m
* @returns pressure in Pa
*/
function poreEntryPressure(args) {
	const sigma = positive("surfaceTension", args.surfaceTension);
	const cos = cosDeg(contactAngle("contactAngleDeg", args.contactAngleDeg));
	const r = positive("poreRadius", args.poreRadius);
	return finiteResult("pore entry pressure", 2 * sigma * cos / r);
}
// packages/calc-core/dist/formulas/tensiometry.js
function wettingCos(angleDeg) {
	contactAngle("contactAngleDeg", angleDeg);
	if (angleDeg >= 90) throw new CalcInputError({
		field: "contactAngleDeg",
		code: "ANGLE_NOT_WETTING",
		message: "a surface tension can only be read from a pull with θ below 90°"
	});
	return cosDeg(angleDeg);
}
/**
* Wetted perimeter of a rectangular plate, P = 2(w + t).
* @param width plate width in m
* @param thickness plate thickness in m (0 for an ideal thin plate)
* @returns perimeter in m
*/
function platePerimeter(width, thickness) {
	return 2 * (positive("width", width) + nonNegative("thickness", thickness));
}
/**
* Wilhelmy plate: F = σ·P·cos θ with P = 2(w + t).
* @param args.surfaceTension N/m
* @param args.contactAngleDeg degrees, 0–180
* @param args.width m
* @param args.thickness m
* @returns force in N (negative when θ > 90°: the plate is pushed out)
*/
function wilhelmyForce(args) {
	const sigma = positive("surfaceTension", args.surfaceTension);
	const cos = cosDeg(contactAngle("contactAngleDeg", args.contactAngleDeg));
	return finiteResult("Wilhelmy force", sigma * platePerimeter(args.width, args.thickness) * cos);
}
/**
* Wilhelmy plate read backwards: σ = F / (P·cos θ).
* @param args.force pull in N (> 0)
* @param args.contactAngleDeg degrees, below 90
* @param args.width m
* @param args.thickness m
* @returns surface tension in N/m
*/
function wilhelmySurfaceTension(args) {
	const force = positive("force", args.force);
	const cos = wettingCos(args.contactAngleDeg);
	return finiteResult("surface tension", force / (platePerimeter(args.width, args.thickness) * cos));
}
/**
* Wilhelmy method with a rod or fibre: F = σ·π·d·cos θ.
* @param args.surfaceTension N/m
* @param args.contactAngleDeg degrees, 0–180
* @param args.diameter rod diameter in m
* @returns force in N
*/
function wilhelmyRodForce(args) {
	const sigma = positive("surfaceTension", args.surfaceTension);
	const cos = cosDeg(contactAngle("contactAngleDeg", args.contactAngleDeg));
	return finiteResult("Wilhelmy force", sigma * Math.PI * positive("diameter", args.diameter) * cos);
}
/**
* Rod or fibre read backwards: σ = F / (π·d·cos θ).
* @param args.force pull in N (> 0)
* @param args.contactAngleDeg degrees, below 90
* @param args.diameter rod diameter in m
* @returns surface tension in N/m
*/
function wilhelmyRodSurfaceTension(args) {
	const force = positive("force", args.force);
	const cos = wettingCos(args.contactAngleDeg);
	return finiteResult("surface tension", force / (Math.PI * positive("diameter", args.diameter) * cos));
}
/**
* The constants of the Zuidema–Waters (1941) fit as ASTM D971 writes it (from memory, not read
* from the printed standard here): f = base + √(k·P/(C²·(D − d)) + c − m·r/R), P in dyn/cm, C in cm,
* D − d in g/mL. The working is built from these same numbers.
*/
var ZUIDEMA_WATERS = {
	base: .725,
	k: .01452,
	c: .04534,
	m: 1.679
};
/**
* The range over which Harkins & Jordan (1930) tabulate the ring factor, which the Zuidema–Waters
* fit reproduces: R/r about 30–80, R³/V about 0.3–4.5, f about 0.75–1.05. Recalled, not seen
* printed here (from memory); outside it the fit is an extrapolation.
*/
var RING_TABLE_RANGE = {
	ringToWire: {
		min: 30,
		max: 80
	},
	r3OverV: {
		min: .3,
		max: 4.5
	},
	factor: {
		min: .75,
		max: 1.05
	}
};
/**
* The Zuidema–Waters correction of a du Noüy ring reading with everything a checker needs: the
* apparent value, R/r, the lifted volume and R³/V (the variables of Harkins & Jordan's tables),
* the radicand and its root, and the factor. Never throws on range: the caller decides.
*
* The constant k carries gravity (f depends on R³/V, and V = F/(Δρ·g)); we take it as fitted at
* standard gravity and scale the term by gₙ/g. That scaling follows from the dimensions; ASTM
* writes no g. With `gravity` absent the expression is exactly ASTM's.
* @param args.force maximum pull, net of the ring's weight, in N
* @param args.ringRadius mean ring radius R in m
* @param args.wireRadius wire radius r in m
* @param args.densityDifference density of the lower phase minus the upper, kg/m³
* @param args.gravity m/s², standard gravity when absent
*/
function ringCorrection(args) {
	const force = positive("force", args.force);
	const R = positive("ringRadius", args.ringRadius);
	const r = positive("wireRadius", args.wireRadius);
	const drho = positive("densityDifference", args.densityDifference);
	const g = positive("gravity", args.gravity ?? 9.80665);
	if (r >= R) throw new CalcInputError({
		field: "wireRadius",
		code: "WIRE_NOT_THINNER_THAN_RING",
		message: "the wire radius must be smaller than the ring radius"
	});
	const apparent = finiteResult("apparent surface tension", force / (4 * Math.PI * R));
	const pDynPerCm = apparent * 1e3;
	const circumferenceCm = 2 * Math.PI * R * 100;
	const drhoGPerMl = drho / 1e3;
	const { base, k, c, m } = ZUIDEMA_WATERS;
	const radicand = k * pDynPerCm * (STANDARD_GRAVITY / g) / (circumferenceCm ** 2 * drhoGPerMl) + c - m * (r / R);
	const root = radicand >= 0 ? Math.sqrt(radicand) : null;
	const liftedVolume = force / (drho * g);
	const ringToWire = R / r;
	const r3OverV = R ** 3 / liftedVolume;
	const t = RING_TABLE_RANGE;
	return {
		apparent,
		ringToWire,
		liftedVolume,
		r3OverV,
		radicand,
		root,
		factor: root === null ? null : base + root,
		inTableRange: ringToWire >= t.ringToWire.min && ringToWire <= t.ringToWire.max && r3OverV >= t.r3OverV.min && r3OverV <= t.r3OverV.max
	};
}
/**
* du Noüy ring, σ = f·F/(4πR), with the Zuidema–Waters (1941) factor in the form ASTM D971 gives:
* f = 0.7250 + √(0.01452·P / (C²·(D − d)) + 0.04534 − 1.679·r/R), where P is the apparent value in
* mN/m (dyn/cm), C = 2πR the ring circumference in cm, D − d the density difference of the two
* phases in g/mL and r/R the wire-to-ring radius ratio (see `ringCorrection` for gravity).
* @param args.force maximum pull, net of the ring's weight, in N
* @param args.ringRadius mean ring radius R in m
* @param args.wireRadius wire radius r in m
* @param args.densityDifference density of the lower phase minus the upper, kg/m³ (≈ liquid density against air)
* @param args.gravity m/s², standard gravity when absent
* @returns corrected and apparent surface tension in N/m and the factor
* @throws RangeError where the square root's argument is negative (outside the correction's range)
*/
function duNouySurfaceTension(args) {
	const x = ringCorrection(args);
	if (x.factor === null) throw new RangeError(`du Noüy ring: outside the range of the Zuidema–Waters correction (0.01452·P/(C²·(D − d)) + 0.04534 − 1.679·r/R = ${x.radicand.toPrecision(3)} must not be negative)`);
	return {
		surfaceTension: finiteResult("surface tension", x.factor * x.apparent),
		apparentSurfaceTension: x.apparent,
		correctionFactor: x.factor
	};
}
// packages/calc-core/dist/formulas/soil.js
/**
* The published range of Hazen's constant C in m² (0.1–0.5 cm²): Terzaghi & Peck (1948) as given in
* Smith's Elements of Soil Mechanics ("10 to 50 mm²") and in Holtz & Kovacs.
*/
var HAZEN_C_RANGE_M2 = {
	min: 1e-5,
	max: 5e-5
};
/**
* Hazen's formula for the height of capillary rise in a soil, h_c = C / (e·D10), written by
* Terzaghi & Peck in cm (C in cm², D10 in cm); dimensionally the same in SI.
* @param args.d10 effective grain size D10 in m
* @param args.voidRatio void ratio e (dimensionless, > 0)
* @param args.c Hazen's constant in m², 1e-5 to 5e-5 (0.1–0.5 cm²)
* @returns height of capillary rise above the water table in m
* @throws RangeError when c is outside the published 0.1–0.5 cm²
*/
function hazenCapillaryRise(args) {
	const d10 = positive("d10", args.d10);
	const e = positive("voidRatio", args.voidRatio);
	const c = finite("c", args.c);
	if (c < HAZEN_C_RANGE_M2.min * (1 - 1e-9) || c > HAZEN_C_RANGE_M2.max * (1 + 1e-9)) throw new RangeError(`Hazen's formula: C = ${c} m² is outside the published range of 1e-5–5e-5 m² (0.1–0.5 cm²)`);
	return c / (e * d10);
}
/**
* Capillary-break check for a granular layer directly under a slab, through the layered profile.
* At equilibrium the suction at a height z above the water table is ρ·g·z, and a material holds
* water only up to its own capillary height above the water table. Water climbs from the water
* table through the soil, up to min(h_soil, base of the layer); only if it reaches the base of the
* layer can the layer take it further, up to the layer's own h_layer. A layer whose own rise would
* end below its base stays dry and adds nothing, and a soil fringe that stops below the layer never
* wets the layer at all.
* @param args.waterTableDepth depth of the water table below the underside of the slab, m (≥ 0)
* @param args.soilRise capillary height of the soil under the layer, m
* @param args.layer the granular layer, thickness and capillary height in m; absent for a slab on soil
* @returns the top of the wet zone, the clearance below the slab (m) and the verdicts
*/
function capillaryBreakCheck(args) {
	const depth = nonNegative("waterTableDepth", args.waterTableDepth);
	const soilRise = nonNegative("soilRise", args.soilRise);
	if (args.layer === void 0) return {
		wetZoneTop: soilRise,
		clearance: depth - soilRise,
		reachesSlab: depth - soilRise <= 0,
		soilReachesLayer: false
	};
	const thickness = positive("layer.thickness", args.layer.thickness);
	const layerRise = nonNegative("layer.rise", args.layer.rise);
	const layerBase = Math.max(depth - thickness, 0);
	const soilReachesLayer = soilRise >= layerBase;
	const wetZoneTop = soilReachesLayer ? Math.max(layerBase, layerRise) : soilRise;
	const clearance = depth - wetZoneTop;
	return {
		wetZoneTop,
		clearance,
		reachesSlab: clearance <= 0,
		soilReachesLayer
	};
}
// packages/calc-core/dist/formulas/wicking.js
function drive(args) {
	contactAngle("contactAngleDeg", args.contactAngleDeg);
	if (args.contactAngleDeg >= 90) throw new CalcInputError({
		field: "contactAngleDeg",
		code: "NO_SPONTANEOUS_WICKING",
		message: "at a contact angle of 90° or more the liquid does not wick in by itself"
	});
	const r = positive("poreRadius", args.poreRadius);
	const sigma = positive("surfaceTension", args.surfaceTension);
	const mu = positive("viscosity", args.viscosity);
	return sigma * r * cosDeg(args.contactAngleDeg) / (2 * mu);
}
/**
* Lucas–Washburn time to wick a distance L: t = 2μ·L² / (σ·r·cos θ).
* @param args.length distance (or height, gravity neglected) in m
* @returns time in s
*/
function washburnTime(args) {
	const length = positive("length", args.length);
	return finiteResult("wicking time", length * length / drive(args));
}
/**
* Lucas–Washburn distance wicked in a time t: L = √(σ·r·t·cos θ / (2μ)).
* @param args.time s
* @returns distance in m
*/
function washburnLength(args) {
	const time = positive("time", args.time);
	return finiteResult("wicking distance", Math.sqrt(drive(args) * time));
}
/**
* Time for a vertical rise to reach a height h with gravity kept in Washburn's equation of motion,
* dh/dt = (r²·ρ·g / 8μ)·(h_J − h)/h, which integrates to
* t = (8μ / (r²·ρ·g))·(−h − h_J·ln(1 − h/h_J)), h_J = 2σ·cos θ/(ρ·g·r) being Jurin's height.
* Equals `washburnTime` as h/h_J → 0 and grows without bound as h → h_J.
* @param args.height m, below Jurin's height
* @param args.density kg/m³
* @param args.gravity m/s², standard gravity when absent
* @returns time in s
* @throws RangeError when the height is at or above Jurin's height (it is never reached)
*/
function gravityRestrainedRiseTime(args) {
	const h = positive("height", args.height);
	const coeff = drive(args);
	const rho = positive("density", args.density);
	const g = positive("gravity", args.gravity ?? 9.80665);
	const r = args.poreRadius;
	const jurin = 2 * args.surfaceTension * cosDeg(args.contactAngleDeg) / (rho * g * r);
	const x = h / jurin;
	if (!(x < 1)) throw new RangeError(`rise time: a height of ${h} m is at or above the Jurin limit of ${jurin.toPrecision(4)} m`);
	const shape = gravityShape(x);
	return finiteResult("rise time", 2 * jurin * jurin / coeff * shape);
}
/**
* The shape term of the rise time with gravity, −x − ln(1 − x), x = h/h_J in [0, 1).
* It loses its digits to cancellation for small x; the series is exact enough there.
*/
function gravityShape(x) {
	return x < 1e-4 ? x * x * (1 / 2 + x * (1 / 3 + x * (1 / 4 + x / 5))) : -x - Math.log1p(-x);
}
/** τ − 1 + e^(−τ), with a series where the subtraction would lose the digits (τ small). */
function bosanquetShape(tau) {
	return tau < .001 ? tau * tau * (1 / 2 - tau * (1 / 6 - tau / 24)) : tau + Math.expm1(-tau);
}
/**
* Horizontal capillary penetration with inertia, Bosanquet (1923): d/dt(ρ·x·dx/dt) = 2σ·cos θ/r −
* (8μ/r²)·x·dx/dt. With y = x² it is linear, ÿ + b·ẏ = a, and from rest (y = ẏ = 0) it integrates to
* x² = (a/b²)·(b·t − 1 + e^(−b·t)), a = 4σ·cos θ/(ρ·r), b = 8μ/(ρ·r²). Long after 1/b it is the
* Lucas–Washburn law; at first x = √(a/2)·t, the inertial limit. Solved here for t by Newton's method
* from the right of the root (the left side is convex and increasing in t, so the steps fall
* monotonically onto it).
* @param args.length distance in m
* @param args.density kg/m³
* @returns time in s, with a, b and b·t
*/
function bosanquetTime(args) {
	const L = positive("length", args.length);
	drive(args);
	const rho = positive("density", args.density);
	const r = args.poreRadius;
	const a = 4 * args.surfaceTension * cosDeg(args.contactAngleDeg) / (rho * r);
	const b = 8 * args.viscosity / (rho * r * r);
	const k = L * L * b * b / a;
	if (!Number.isFinite(k)) throw new RangeError("Bosanquet time: the inputs are outside floating-point range");
	let tau = k + 1;
	for (let i = 0; i < 200; i++) {
		const next = tau - (bosanquetShape(tau) - k) / -Math.expm1(-tau);
		if (!(next < tau)) break;
		tau = next;
	}
	return {
		time: finiteResult("Bosanquet time", tau / b),
		a,
		b,
		tau
	};
}
// packages/calc-core/dist/hash.js
/**
* JSON with object keys sorted at every level and no white space. Numbers use JavaScript's
* shortest round-trip form, which the language specifies exactly, so every engine agrees.
* @throws TypeError for non-finite numbers, which JSON cannot carry
*/
function canonicalJson(value) {
	if (value === null || typeof value === "boolean" || typeof value === "string") return JSON.stringify(value);
	if (typeof value === "number") {
		if (!Number.isFinite(value)) throw new TypeError("canonicalJson: numbers must be finite");
		return JSON.stringify(value);
	}
	if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v)).join(",")}]`;
	const obj = value;
	return `{${Object.keys(obj).sort().map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k])}`).join(",")}}`;
}
function utf8(text) {
	const out = [];
	for (let i = 0; i < text.length; i++) {
		let cp = text.charCodeAt(i);
		if (cp >= 55296 && cp <= 56319 && i + 1 < text.length) {
			const low = text.charCodeAt(i + 1);
			if (low >= 56320 && low <= 57343) {
				cp = 65536 + (cp - 55296 << 10) + (low - 56320);
				i++;
			}
		}
		if (cp >= 55296 && cp <= 57343) cp = 65533;
		if (cp < 128) out.push(cp);
		else if (cp < 2048) out.push(192 | cp >> 6, 128 | cp & 63);
		else if (cp < 65536) out.push(224 | cp >> 12, 128 | cp >> 6 & 63, 128 | cp & 63);
		else out.push(240 | cp >> 18, 128 | cp >> 12 & 63, 128 | cp >> 6 & 63, 128 | cp & 63);
	}
	return out;
}
function fractionBits(x) {
	return (x - Math.floor(x)) * 4294967296 >>> 0;
}
function firstPrimes(count) {
	const primes = [];
	for (let n = 2; primes.length < count; n++) if (primes.every((p) => n % p !== 0)) primes.push(n);
	return primes;
}
var tables;
function constants() {
	if (tables === void 0) {
		const primes = firstPrimes(64);
		tables = {
			k: Uint32Array.from(primes, (p) => fractionBits(Math.cbrt(p))),
			h0: Uint32Array.from(primes.slice(0, 8), (p) => fractionBits(Math.sqrt(p)))
		};
	}
	return tables;
}
/** SHA-256 of the UTF-8 bytes of `text`, as 64 lower-case hex digits. */
function sha256Hex(text) {
	const { k, h0 } = constants();
	const message = utf8(text);
	const bitLength = message.length * 8;
	const padded = new Uint8Array((message.length + 8 >> 6) + 1 << 6);
	padded.set(message);
	padded[message.length] = 128;
	const view = new DataView(padded.buffer);
	view.setUint32(padded.length - 4, bitLength >>> 0);
	view.setUint32(padded.length - 8, Math.floor(bitLength / 4294967296));
	const h = Uint32Array.from(h0);
	const w = /* @__PURE__ */ new Uint32Array(64);
	const rotr = (x, n) => x >>> n | x << 32 - n;
	for (let off = 0; off < padded.length; off += 64) {
		for (let i = 0; i < 16; i++) w[i] = view.getUint32(off + i * 4);
		for (let i = 16; i < 64; i++) {
			const a = w[i - 15];
			const b = w[i - 2];
			const s0 = rotr(a, 7) ^ rotr(a, 18) ^ a >>> 3;
			const s1 = rotr(b, 17) ^ rotr(b, 19) ^ b >>> 10;
			w[i] = w[i - 16] + s0 + w[i - 7] + s1;
		}
		let a = h[0];
		let b = h[1];
		let c = h[2];
		let d = h[3];
		let e = h[4];
		let f = h[5];
		let g = h[6];
		let hh = h[7];
		for (let i = 0; i < 64; i++) {
			const t1 = hh + (rotr(e, 6) ^ rotr(e, 11) ^ rotr(e, 25)) + (e & f ^ ~e & g) + k[i] + w[i] >>> 0;
			const t2 = (rotr(a, 2) ^ rotr(a, 13) ^ rotr(a, 22)) + (a & b ^ a & c ^ b & c) >>> 0;
			hh = g;
			g = f;
			f = e;
			e = d + t1 >>> 0;
			d = c;
			c = b;
			b = a;
			a = t1 + t2 >>> 0;
		}
		const add = [
			a,
			b,
			c,
			d,
			e,
			f,
			g,
			hh
		];
		for (let i = 0; i < 8; i++) h[i] = h[i] + add[i] >>> 0;
	}
	return Array.from(h, (x) => x.toString(16).padStart(8, "0")).join("");
}
// packages/calc-core/dist/calculators/engine.js
function isPlainObject$1(value) {
	if (typeof value !== "object" || value === null || Array.isArray(value)) return false;
	const proto = Object.getPrototypeOf(value);
	return proto === Object.prototype || proto === null;
}
function rangeText(input) {
	const unit = canonicalUnits[input.kind];
	return `from ${withUnit(formatValue(input.min, 6), unit)} to ${withUnit(formatValue(input.max, 6), unit)}`;
}
/**
* Checks raw inputs against a definition and fills defaults. Choice inputs are resolved first
* because they decide which other inputs apply.
* @returns the resolved inputs, in the definition's order, only those that apply
* @throws CalcInputError listing every bad field at once
*/
function resolveInputs(def, raw) {
	if (!isPlainObject$1(raw)) throw new CalcInputError({
		field: "inputs",
		code: "NOT_AN_OBJECT",
		message: "inputs must be an object keyed by input id"
	});
	const issues = [];
	const known = new Set(def.inputs.map((i) => i.id));
	for (const key of Object.keys(raw)) if (!known.has(key)) issues.push({
		field: key,
		code: "UNKNOWN_INPUT",
		message: `${def.id} has no input "${key}"`
	});
	const choices = /* @__PURE__ */ new Map();
	const badChoices = /* @__PURE__ */ new Set();
	for (const input of def.inputs) {
		if (input.kind !== "choice") continue;
		const value = raw[input.id] === void 0 ? input.default : raw[input.id];
		if (typeof value === "string" && input.options.some((o) => o.value === value)) choices.set(input.id, value);
		else badChoices.add(input.id);
	}
	const chosen = Object.fromEntries(choices);
	const applies = (input) => inputApplies(input, def.inputs, chosen);
	const resolved = {};
	for (const input of def.inputs) {
		if (!applies(input)) continue;
		if (input.kind === "choice") {
			const value = choices.get(input.id);
			if (value !== void 0) resolved[input.id] = value;
			if (badChoices.has(input.id)) issues.push({
				field: input.id,
				code: "NOT_AN_OPTION",
				message: `${input.label} must be one of: ${input.options.map((o) => o.value).join(", ")}`
			});
			continue;
		}
		if (input.kind === "table") {
			const value = raw[input.id] === void 0 ? input.default : raw[input.id];
			if (def.checkTable === void 0) throw new Error(`${def.id}: table input ${input.id} needs checkTable`);
			const found = def.checkTable(input, value);
			if (found.length > 0) issues.push(...found);
			else resolved[input.id] = value.map((row) => Object.fromEntries(input.columns.map((c) => [c.id, row[c.id]])));
			continue;
		}
		const value = raw[input.id] === void 0 ? input.default : raw[input.id];
		const fail = (code, message) => {
			issues.push({
				field: input.id,
				code,
				message: `${input.label} ${message}`
			});
		};
		if (value === null) fail("REQUIRED", "needs a value");
		else if (typeof value !== "number" || Number.isNaN(value)) fail("NOT_A_NUMBER", "must be a number");
		else if (!Number.isFinite(value)) fail("NOT_FINITE", "must be finite");
		else if (value < input.min || value > input.max) fail(value > input.max ? "ABOVE_MAX" : "BELOW_MIN", `must be ${rangeText(input)}`);
		else resolved[input.id] = value;
	}
	if (issues.length > 0) throw new CalcInputError(issues);
	return resolved;
}
function checkSolution(def, solution) {
	const { outputs, warnings, working } = solution;
	for (const out of def.outputs) {
		const v = outputs[out.id];
		if (v === void 0 || v !== null && !Number.isFinite(v)) throw new Error(`${def.id}: output ${out.id} is ${String(v)}`);
	}
	const declared = new Set(def.warnings.map((w) => w.code));
	const steps = new Set(working.map((s) => s.id).filter((id) => id !== void 0));
	for (const w of warnings) {
		if (!declared.has(w.code)) throw new Error(`${def.id}: warning ${w.code} is not declared`);
		if (w.step !== void 0 && !steps.has(w.step)) throw new Error(`${def.id}: warning ${w.code} points at a step ${w.step} the working does not have`);
		for (const id of w.withholds ?? []) if (outputs[id] !== null) throw new Error(`${def.id}: ${w.code} withholds ${id} but it has a value`);
	}
}
/** The stable hash of a calculator's resolved inputs: SHA-256 hex of `{ calculator, inputs }`. */
function hashInputs(calculatorId, inputs) {
	return sha256Hex(canonicalJson({
		calculator: calculatorId,
		inputs
	}));
}
/**
* Runs one calculator: validates, solves, stamps the version and the input hash. Deterministic
* and JSON-serialisable, so the server can re-run a visitor's inputs and compare. A core without
* its texts gives a result whose cautions are the liquid's hazards only.
* @param raw inputs keyed by input id, canonical units (SI, angles in degrees, temperatures in °C)
* @throws CalcInputError listing every bad field
*/
function runCalculation(def, raw) {
	const inputs = resolveInputs(def, raw);
	let solution;
	try {
		solution = def.solve(inputs);
	} catch (err) {
		if (err instanceof RangeError) throw new CalcInputError({
			field: "inputs",
			code: "OUT_OF_RANGE",
			message: err.message
		});
		throw err;
	}
	checkSolution(def, solution);
	return {
		calculator: def.id,
		inputs,
		outputs: solution.outputs,
		warnings: solution.warnings,
		working: solution.working,
		band: solution.band,
		assumptions: solution.assumptions,
		cautions: [...solution.hazards ?? [], ...def.cautions ?? []],
		version: VERSION,
		inputHash: hashInputs(def.id, inputs)
	};
}
/**
* The range of every output over all corners of the spread inputs (2ⁿ evaluations, n ≤ 3 here),
* nominal included. Exact for outputs monotonic in each spread input, which all of ours are.
* @returns null when no input has a spread
*/
function bandOver(basis, nominal, evaluate) {
	if (basis.length === 0) return null;
	const ranges = {};
	const take = (outputs) => {
		for (const [id, v] of Object.entries(outputs)) {
			if (v === null || v === void 0 || typeof nominal[id] !== "number") continue;
			const r = ranges[id];
			if (r === void 0) ranges[id] = {
				low: v,
				high: v
			};
			else {
				r.low = Math.min(r.low, v);
				r.high = Math.max(r.high, v);
			}
		}
	};
	take(nominal);
	for (let mask = 0; mask < 1 << basis.length; mask++) {
		const values = {};
		basis.forEach((b, i) => {
			values[b.input] = mask & 1 << i ? b.high : b.low;
		});
		take(evaluate(values));
	}
	return {
		basis,
		outputs: ranges
	};
}
function close(a, b, tol) {
	return a === b || Math.abs(a - b) <= tol * Math.max(Math.abs(a), Math.abs(b));
}
/**
* Whether two results of the same run agree: same calculator, version, inputs hash and warning
* codes, and every output and band edge within a relative tolerance. Exact equality is not the
* test because Math.exp, Math.pow and Math.cos may differ in the last bit between JavaScript
* engines (the language leaves them implementation-approximated).
* @param relativeTolerance dimensionless; 1e-9 by default
*/
function resultsAgree(a, b, relativeTolerance = 1e-9) {
	if (a.calculator !== b.calculator || a.version !== b.version || a.inputHash !== b.inputHash) return false;
	const codes = (r) => r.warnings.map((w) => w.code).join(",");
	if (codes(a) !== codes(b)) return false;
	const keys = /* @__PURE__ */ new Set([...Object.keys(a.outputs), ...Object.keys(b.outputs)]);
	for (const k of keys) {
		const x = a.outputs[k];
		const y = b.outputs[k];
		if (x === void 0 || y === void 0) return false;
		if (x === null || y === null ? x !== y : !close(x, y, relativeTolerance)) return false;
	}
	if (a.band === null !== (b.band === null)) return false;
	if (a.band !== null && b.band !== null) {
		const bandKeys = /* @__PURE__ */ new Set([...Object.keys(a.band.outputs), ...Object.keys(b.band.outputs)]);
		for (const k of bandKeys) {
			const x = a.band.outputs[k];
			const y = b.band.outputs[k];
			if (x === void 0 || y === void 0) return false;
			if (!close(x.low, y.low, relativeTolerance) || !close(x.high, y.high, relativeTolerance)) return false;
		}
	}
	return true;
}
// packages/calc-core/dist/formulas/absorption.js
/**
* Ordinary least squares y = a + b·x, with the sums shown so the fit can be checked by hand:
* b = Sxy / Sxx, a = ȳ − b·x̄, R² = Sxy² / (Sxx·Syy).
* @throws CalcInputError when fewer than 2 points or every x is the same
*/
function fitLine(points) {
	const n = points.length;
	if (n < 2) throw new CalcInputError({
		field: "readings",
		code: "TOO_FEW_POINTS",
		message: "a straight line needs at least two readings"
	});
	let sumX = 0;
	let sumY = 0;
	points.forEach((p, i) => {
		sumX += finite(`readings.${i}.x`, p.x);
		sumY += finite(`readings.${i}.y`, p.y);
	});
	const meanX = sumX / n;
	const meanY = sumY / n;
	let sxx = 0;
	let sxy = 0;
	let syy = 0;
	for (const p of points) {
		const dx = p.x - meanX;
		const dy = p.y - meanY;
		sxx += dx * dx;
		sxy += dx * dy;
		syy += dy * dy;
	}
	if (sxx === 0) throw new CalcInputError({
		field: "readings",
		code: "NO_SPREAD",
		message: "the readings must be at different times"
	});
	const slope = sxy / sxx;
	return {
		n,
		slope,
		intercept: meanY - slope * meanX,
		rSquared: syy === 0 ? 1 : sxy * sxy / (sxx * syy),
		meanX,
		meanY,
		sxx,
		sxy,
		syy
	};
}
/**
* The points of a partial-immersion test as the fit takes them: x = √t in √s, y = (m_t − m_0)/A in
* kg/m², from readings of time (s) and specimen mass (kg), the first at t = 0.
*/
function absorptionPoints(readings, faceArea) {
	const area = positive("faceArea", faceArea);
	const first = readings[0];
	if (!first || first.time !== 0) throw new CalcInputError({
		field: "readings.0.time",
		code: "NO_ZERO_READING",
		message: "the first reading must be the dry mass at time 0"
	});
	return readings.map((r, i) => ({
		x: Math.sqrt(finite(`readings.${i}.time`, r.time)),
		y: (finite(`readings.${i}.mass`, r.mass) - first.mass) / area
	}));
}
/**
* The times (s) whose readings enter the straight-line fit, inclusive. EN ISO 15148 fits every
* weighing after the dry one (from memory: 5 min, 20 min, 1 h, 2 h, 4 h, 8 h and 24 h); ASTM C1585
* fits the initial rate from 1 min to 6 h (from memory), leaving the later, slower uptake out.
*/
var FIT_WINDOW_S = {
	"en-iso-15148": [Number.MIN_VALUE, Number.POSITIVE_INFINITY],
	"astm-c1585": [60, 21600]
};
/** Whether a reading at `timeS` seconds enters the fit under `method`. */
function inFitWindow(method, timeS) {
	const [from, to] = FIT_WINDOW_S[method];
	return timeS >= from && timeS <= to;
}
// packages/calc-core/dist/calculators/table.js
function isPlainObject(value) {
	if (typeof value !== "object" || value === null || Array.isArray(value)) return false;
	const proto = Object.getPrototypeOf(value);
	return proto === Object.prototype || proto === null;
}
/** Where a problem in a table sits: `readings`, `readings.2` or `readings.2.mass`. */
function tableField(inputId, rowIndex, columnId) {
	if (rowIndex === void 0) return inputId;
	return columnId === void 0 ? `${inputId}.${rowIndex}` : `${inputId}.${rowIndex}.${columnId}`;
}
/** Reads a table field path back: the input id, and the row index and column where it names them. */
function parseTableField(field) {
	const [input = "", row, column] = field.split(".");
	const index = row !== void 0 && /^\d+$/.test(row) ? Number(row) : void 0;
	return {
		input,
		...index !== void 0 ? { row: index } : {},
		...column !== void 0 ? { column } : {}
	};
}
/** `Readings, row 3, mass` — how a person finds the cell. */
function cellName(input, rowIndex, column) {
	return `${input.label}, row ${rowIndex + 1}${column ? `, ${column.label.toLowerCase()}` : ""}`;
}
function shownIn(column, value, wording) {
	const unit = wording.units?.[column.id] ?? canonicalUnits[column.kind];
	return withUnit(formatValue(fromCanonical(value, unit), 6), unit);
}
function where(input, i, column, wording) {
	if (wording.rowName === void 0) return cellName(input, i, column);
	return `${wording.rowName(i)}${column ? `, ${column.label.toLowerCase()}` : ""}`;
}
/**
* Every problem with a table's raw value, in row order; no problem means `value` is the rows.
* @param value what was sent: an array of `{ <column id>: number }` objects, canonical units
*/
function tableIssues(input, value, wording = {}) {
	const issues = [];
	const issue = (field, code, message) => {
		issues.push({
			field,
			code,
			message
		});
	};
	if (!Array.isArray(value)) {
		issue(input.id, "NOT_A_TABLE", `${input.label} must be a list of rows`);
		return issues;
	}
	const rows = value;
	if (rows.length < input.minRows) issue(input.id, "TOO_FEW_ROWS", `${input.label} needs at least ${input.minRows} rows; ${rows.length === 1 ? "there is 1" : `there are ${rows.length}`}`);
	if (rows.length > input.maxRows) {
		issue(input.id, "TOO_MANY_ROWS", `${input.label} takes at most ${input.maxRows} rows; there are ${rows.length}`);
		return issues;
	}
	const known = new Set(input.columns.map((c) => c.id));
	const previous = /* @__PURE__ */ new Map();
	rows.forEach((row, i) => {
		if (!isPlainObject(row)) {
			issue(tableField(input.id, i), "ROW_NOT_AN_OBJECT", `${cellName(input, i)} must have a value in each column`);
			return;
		}
		for (const key of Object.keys(row)) if (!known.has(key)) issue(tableField(input.id, i, key), "UNKNOWN_COLUMN", `${where(input, i, void 0, wording)} has no column "${key}"`);
		for (const column of input.columns) {
			const field = tableField(input.id, i, column.id);
			const v = row[column.id];
			const cell = where(input, i, column, wording);
			const shown = (x) => shownIn(column, x, wording);
			if (v === void 0 || v === null) issue(field, "REQUIRED", `${cell}: needs a value`);
			else if (typeof v !== "number" || Number.isNaN(v)) issue(field, "NOT_A_NUMBER", `${cell}: must be a number`);
			else if (!Number.isFinite(v)) issue(field, "NOT_FINITE", `${cell}: must be finite`);
			else if (v < column.min || v > column.max) issue(field, v > column.max ? "ABOVE_MAX" : "BELOW_MIN", `${cell}: must be from ${shown(column.min)} to ${shown(column.max)}`);
			else {
				const before = previous.get(column.id);
				if (column.increasing === true && before !== void 0 && !(v > before)) issue(field, "NOT_INCREASING", `${cell}: must be later than the row above (${shown(before)}); rows go in time order`);
				previous.set(column.id, v);
			}
		}
	});
	return issues;
}
/** The rows of a table that passed `tableIssues`, copied to plain objects in column order. */
function tableRows(input, value) {
	return value.map((row) => Object.fromEntries(input.columns.map((c) => [c.id, row[c.id]])));
}
/**
* A table input's rows in the units a unit system shows them in: the one rule the widget, the
* e-mail, the sheet and the dashboard's run page follow.
*/
function showTable(input, rows, system) {
	const unitsOf = input.columns.map((c) => displayUnitOf(c, system));
	const values = rows.map((row) => input.columns.map((c, j) => fromCanonical(row[c.id] ?? NaN, unitsOf[j])));
	return {
		columns: input.columns.map((c, j) => ({
			id: c.id,
			label: c.label,
			unit: unitSymbol(unitsOf[j])
		})),
		rows: values,
		text: values.map((r) => r.map((v) => formatValue(v, 6)))
	};
}
/** One line for a table: `8 rows of time (min), mass (g)`. */
function tableSummary(input, rows, system) {
	const cols = input.columns.map((c) => `${c.label.toLowerCase()} (${unitSymbol(displayUnitOf(c, system))})`);
	return `${rows.length} ${rows.length === 1 ? "row" : "rows"} of ${cols.join(", ")}`;
}
/**
* Rows typed, pasted or read from a file, as text cells in the table's column order and in the
* given units, turned into canonical rows; every problem is named by row and column, and no rows
* come back unless every cell is good (nothing half-applied).
* @param cells one array of cell texts per row (a header row already taken off)
* @param parse the number reader (`parseNumber`): null for an empty cell, NaN for unreadable text
*/
function rowsFromCells(input, cells, parse, wording = {}) {
	const issues = [];
	const raw = cells.map((row, i) => {
		if (row.length > input.columns.length && row.slice(input.columns.length).some((c) => c.trim() !== "")) issues.push({
			field: tableField(input.id, i),
			code: "TOO_MANY_CELLS",
			message: `${where(input, i, void 0, wording)} has ${row.length} cells; the table has ${input.columns.length} columns (${input.columns.map((c) => c.label.toLowerCase()).join(", ")})`
		});
		return Object.fromEntries(input.columns.map((c, j) => {
			const n = parse(row[j] ?? "");
			const unit = wording.units?.[c.id];
			return [c.id, n === null ? null : unit === void 0 || Number.isNaN(n) ? n : toCanonical(n, unit)];
		}));
	});
	issues.push(...tableIssues(input, raw, wording));
	return issues.length > 0 ? {
		rows: null,
		issues
	} : {
		rows: tableRows(input, raw),
		issues: []
	};
}
/** Resolved inputs as plain, mutable JSON (table rows copied): what a run report and a stored run carry. */
function plainInputs(inputs) {
	return Object.fromEntries(Object.entries(inputs).map(([k, v]) => [k, typeof v === "object" ? v.map((r) => ({ ...r })) : v]));
}
// packages/calc-core/dist/calculators/shared.js
/** Superscript digits, for the powers of t in a printed polynomial (Kell 1975). */
var SUPERSCRIPT = {
	"2": "²",
	"3": "³",
	"4": "⁴",
	"5": "⁵"
};
/** A number with its unit symbol, spaced by the one rule (`display.ts`): `0.07274 N/m`, `20 °C`, `0°`. */
function q(value, unit, digits = 4) {
	return withUnit(formatValue(value, digits), unit);
}
/**
* A published coefficient exactly as the code holds it (all its digits, a true minus sign), so the
* working shows the very number computed with.
*/
function coef(value) {
	return String(value).replace("-", "−");
}
/** A warning instance; `fields` are the input ids a form should highlight. */
function warning(code, message, fields, extra = {}) {
	return {
		code,
		message,
		fields,
		...extra.step !== void 0 ? { step: extra.step } : {},
		...extra.withholds !== void 0 && extra.withholds.length > 0 ? { withholds: extra.withholds } : {}
	};
}
/** A resolved numeric input; throws if the definition and the solver disagree (a calc-core bug). */
function num(inputs, id) {
	const v = inputs[id];
	if (typeof v !== "number") throw new Error(`input ${id} is not a resolved number`);
	return v;
}
/** A resolved choice input. */
function choice(inputs, id) {
	const v = inputs[id];
	if (typeof v !== "string") throw new Error(`input ${id} is not a resolved choice`);
	return v;
}
/** Small lengths read best in millimetres and inches. */
var MM = {
	si: "mm",
	us: "in"
};
/** A numeric input; bounds are the physical range the formulas are used over, canonical units. */
function quantityInput(kind, id, label, defaultValue, range, extra = {}) {
	return {
		id,
		label,
		kind,
		default: defaultValue,
		min: range[0],
		max: range[1],
		...extra
	};
}
var CUSTOM = "custom";
/** The liquid choice, the water temperature and the custom property inputs. */
function liquidInputs(needs) {
	const when = needs.when ?? [];
	const custom = [...when, {
		input: "liquid",
		values: [CUSTOM]
	}];
	const list = [
		{
			id: "liquid",
			label: "Liquid",
			kind: "choice",
			default: "water",
			options: [
				{
					value: "water",
					label: "Water",
					help: "Properties from the IAPWS, Tanaka and Kell correlations at the temperature given."
				},
				...liquids.map((l) => ({
					value: l.id,
					label: l.name,
					help: `Table values at ${l.temperatureC} °C.`
				})),
				{
					value: CUSTOM,
					label: "Other (enter properties)"
				}
			],
			...when.length > 0 ? { appliesWhen: when } : {}
		},
		{
			id: "temperatureC",
			label: "Water temperature",
			kind: "temperature",
			default: 20,
			min: .01,
			max: 100,
			help: "Sets the surface tension, density and viscosity of water. 0.01 °C is the triple point, below which IAPWS R1-76 does not go.",
			appliesWhen: [...when, {
				input: "liquid",
				values: ["water"]
			}]
		},
		quantityInput("surfaceTension", "surfaceTension", "Surface tension", .072, [.001, 1], { appliesWhen: custom })
	];
	if (needs.density === true) list.push(quantityInput("density", "density", "Liquid density", 1e3, [100, 25e3], { appliesWhen: custom }));
	if (needs.viscosity === true) list.push(quantityInput("viscosity", "viscosity", "Viscosity", .001, [1e-5, 100], { appliesWhen: custom }));
	return list;
}
var IAPWS_ST = "IAPWS R1-76(2014)";
var SR6 = "IAPWS SR6-08 (2011)";
function waterProperty(compute) {
	try {
		return compute();
	} catch (err) {
		if (err instanceof RangeError) throw new CalcInputError({
			field: "temperatureC",
			code: "OUT_OF_CORRELATION_RANGE",
			message: err.message
		});
		throw err;
	}
}
/**
* σ, ρ and μ for the chosen liquid, with one working line each for what the calculator uses.
* Values not asked for are NaN-free placeholders (0) and carry no working.
*/
function resolveLiquid(inputs, needs) {
	const id = choice(inputs, "liquid");
	const working = [];
	if (id === "water") {
		const t = num(inputs, "temperatureC");
		const T = t + 273.15;
		const sigma = waterProperty(() => waterSurfaceTension(t));
		const { B, b, mu: expo, Tc } = IAPWS_R1_76;
		const tau = 1 - T / Tc;
		working.push({
			label: `Surface tension of water at ${q(t, "degC")}`,
			formula: `σ = B·τ^μ·(1 + b·τ), τ = 1 − T / Tc; B = ${coef(B * 1e3)} mN/m, b = ${coef(b)}, μ = ${coef(expo)}, Tc = ${coef(Tc)} K`,
			substituted: `T = ${q(T, "K", 6)}, τ = 1 − ${formatValue(T, 6)} / ${coef(Tc)} = ${formatValue(tau, 6)}; σ = ${coef(B)} N/m × ${formatValue(tau, 6)}^${coef(expo)} × (1 + (${coef(b)}) × ${formatValue(tau, 6)})`,
			value: sigma,
			unit: "N/m",
			source: IAPWS_ST
		});
		let rho = 0;
		if (needs.density === true) {
			const d = waterProperty(() => waterDensity(t));
			rho = d.value;
			const { a1, a2, a3, a4, a5 } = TANAKA_2001;
			const kellTerms = KELL_1975.a.map((a, n) => n === 0 ? coef(a) : `${coef(a)}·t${n === 1 ? "" : SUPERSCRIPT[String(n)]}`);
			working.push({
				label: `Density of water at ${q(t, "degC")}`,
				formula: d.formulation === "tanaka-2001" ? `ρ = a₅·[1 − (t + a₁)²·(t + a₂) / (a₃·(t + a₄))]; a₁ = ${coef(a1)} °C, a₂ = ${coef(a2)} °C, a₃ = ${coef(a3)} °C², a₄ = ${coef(a4)} °C, a₅ = ${coef(a5)} kg/m³` : `ρ = (${kellTerms.join(" + ").replaceAll("+ −", "− ")}) / (1 + ${coef(KELL_1975.b)}·t), kg/m³, t in °C`,
				substituted: d.formulation === "tanaka-2001" ? `t = ${q(t, "degC")}: ${coef(a5)} × [1 − (${formatValue(t + a1, 6)})² × ${formatValue(t + a2, 6)} / (${coef(a3)} × ${formatValue(t + a4, 6)})]` : `t = ${q(t, "degC")}`,
				value: rho,
				unit: "kg/m3",
				source: d.formulation === "tanaka-2001" ? "Tanaka et al. 2001" : "Kell 1975"
			});
		}
		let mu = 0;
		if (needs.viscosity === true) {
			mu = waterProperty(() => waterViscosity(t));
			const { a, b: bs, Tstar } = IAPWS_SR6_08;
			working.push({
				label: `Viscosity of water at ${q(t, "degC")}`,
				formula: `μ = Σ aᵢ·(T / ${coef(Tstar)} K)^bᵢ μPa·s; a = ${a.map(coef).join(", ")}; b = ${bs.map(coef).join(", ")}`,
				substituted: `T / ${coef(Tstar)} K = ${formatValue(T / Tstar, 6)}`,
				value: mu,
				unit: "Pa*s",
				source: SR6
			});
		}
		return {
			id,
			name: "water",
			surfaceTension: sigma,
			density: rho,
			viscosity: mu,
			working,
			assumption: `Pure, air-free water at ${q(t, "degC")} and atmospheric pressure, properties from the IAPWS, Tanaka and Kell correlations.`
		};
	}
	if (id === "custom") {
		const sigma = num(inputs, "surfaceTension");
		working.push({
			label: "Surface tension (entered)",
			formula: "σ",
			substituted: q(sigma, "N/m"),
			value: sigma,
			unit: "N/m"
		});
		const rho = needs.density === true ? num(inputs, "density") : 0;
		if (needs.density === true) working.push({
			label: "Density (entered)",
			formula: "ρ",
			substituted: q(rho, "kg/m3"),
			value: rho,
			unit: "kg/m3"
		});
		const mu = needs.viscosity === true ? num(inputs, "viscosity") : 0;
		if (needs.viscosity === true) working.push({
			label: "Viscosity (entered)",
			formula: "μ",
			substituted: q(mu, "Pa*s"),
			value: mu,
			unit: "Pa*s"
		});
		return {
			id,
			name: "the liquid",
			surfaceTension: sigma,
			density: rho,
			viscosity: mu,
			working,
			hazard: OTHER_LIQUID_CAUTION,
			assumption: "The liquid properties as entered, taken as those of the liquid at the temperature of use."
		};
	}
	const row = getLiquid(id);
	if (row === void 0) throw new Error(`liquid ${id} is offered but not tabulated`);
	const at = `at ${q(row.temperatureC, "degC")}`;
	const tableStep = (label, symbol, value, unit, source) => ({
		label: `${label} of ${row.name.toLowerCase()} ${at}`,
		formula: `${symbol} (table value)`,
		substituted: q(value, unit),
		value,
		unit,
		source
	});
	working.push(tableStep("Surface tension", "σ", row.surfaceTension.value, "N/m", row.surfaceTension.source));
	if (needs.density === true) working.push(tableStep("Density", "ρ", row.density.value, "kg/m3", row.density.source));
	if (needs.viscosity === true) working.push(tableStep("Viscosity", "μ", row.viscosity.value, "Pa*s", row.viscosity.source));
	return {
		id,
		name: row.name.toLowerCase(),
		surfaceTension: row.surfaceTension.value,
		density: needs.density === true ? row.density.value : 0,
		viscosity: needs.viscosity === true ? row.viscosity.value : 0,
		working,
		...row.hazard !== void 0 ? { hazard: {
			code: row.hazard.code,
			text: row.hazard.text,
			source: `${row.hazard.source} (${row.hazard.basis})`
		} } : {},
		assumption: `${row.name} at ${q(row.temperatureC, "degC")}, pure, with the table's values; at another temperature they differ.`
	};
}
/** The preset choice (restricted to `presetIds`) and the typed angle used when the choice is `custom`. */
function contactAngleInputs(opts) {
	const when = opts.when ?? [];
	const options = contactAnglePresets.filter((p) => opts.presetIds.includes(p.id)).map((p) => ({
		value: p.id,
		label: p.label,
		help: p.spreadDeg === void 0 ? `${p.angleDeg}°` : `${p.angleDeg}° (${p.spreadDeg.low}–${p.spreadDeg.high}°)`,
		appliesWhen: [{
			input: "liquid",
			values: [p.liquid, CUSTOM]
		}]
	}));
	return [{
		id: "contactAnglePreset",
		label: "Liquid and surface",
		kind: "choice",
		default: opts.defaultPreset,
		options: [...options, {
			value: CUSTOM,
			label: "Enter the contact angle"
		}],
		...when.length > 0 ? { appliesWhen: when } : {}
	}, {
		id: "contactAngleDeg",
		label: "Contact angle",
		kind: "angle",
		default: 0,
		min: 0,
		max: opts.maxDeg ?? 180,
		help: "Measured through the liquid: 0° wets fully, above 90° the liquid is depressed.",
		appliesWhen: [...when, {
			input: "contactAnglePreset",
			values: [CUSTOM]
		}]
	}];
}
/** The contact angle from the preset or the typed value; a preset for another liquid is refused. */
function resolveContactAngle(inputs, liquidId) {
	const presetId = choice(inputs, "contactAnglePreset");
	if (presetId === "custom") {
		const a = num(inputs, "contactAngleDeg");
		return {
			angleDeg: a,
			basis: [],
			assumption: `A contact angle of ${q(a, "deg")} as entered, taken as the static angle of the liquid on this surface.`,
			working: [{
				label: "Contact angle (entered)",
				formula: "θ",
				substituted: q(a, "deg"),
				value: a,
				unit: "deg"
			}]
		};
	}
	const preset = getContactAnglePreset(presetId);
	if (preset === void 0) throw new Error(`contact-angle preset ${presetId} is offered but not defined`);
	if (liquidId !== "custom" && preset.liquid !== liquidId) throw new CalcInputError({
		field: "contactAnglePreset",
		code: "PRESET_LIQUID_MISMATCH",
		message: `"${preset.label}" is for ${preset.liquid}, not the liquid chosen; pick a matching preset or enter the angle`
	});
	const spread = preset.spreadDeg;
	return {
		angleDeg: preset.angleDeg,
		assumption: `A contact angle of ${q(preset.angleDeg, "deg")} from the preset "${preset.label}" (${preset.source}, ${preset.basis})${spread === void 0 ? "" : `; the likely range spans ${spread.low}–${spread.high}°`}.`,
		basis: spread === void 0 ? [] : [{
			input: "contactAngleDeg",
			low: spread.low,
			high: spread.high,
			source: `${preset.label}: ${preset.source} (${preset.basis})`
		}],
		working: [{
			label: `Contact angle, ${preset.label.toLowerCase()}`,
			formula: "θ (preset)",
			substituted: spread === void 0 ? q(preset.angleDeg, "deg") : `${q(preset.angleDeg, "deg")} (range ${spread.low}–${spread.high}°)`,
			value: preset.angleDeg,
			unit: "deg",
			source: `${preset.source} (${preset.basis})`
		}]
	};
}
/** The gravity input, m/s², standard gravity by default. */
function gravityInput(when) {
	return {
		id: "gravity",
		label: "Gravity",
		kind: "acceleration",
		default: STANDARD_GRAVITY,
		min: 9.7,
		max: 9.9,
		help: "Standard gravity 9.80665 m/s² unless the local value is known (about 9.78 at the equator to 9.83 at the poles).",
		...when !== void 0 && when.length > 0 ? { appliesWhen: when } : {}
	};
}
/** The inputs that set a contact angle where a preset can stand in for it. */
var ANGLE_FIELDS = ["contactAngleDeg", "contactAnglePreset"];
var CONTACT_ANGLE_NEAR_90 = {
	code: "CONTACT_ANGLE_NEAR_90",
	summary: "The contact angle is within 10° of 90°, where cos θ is small: a few degrees of error in the angle change the result by a large fraction."
};
/**
* The CONTACT_ANGLE_NEAR_90 warning when an angle (degrees) is within 10° of 90°, else null.
* The 10° is our threshold: at 80° a 2° error already changes cos θ by 20 %.
*/
function nearNinety(angleDeg, fields = ANGLE_FIELDS) {
	if (Math.abs(angleDeg - 90) >= 10) return null;
	return warning(CONTACT_ANGLE_NEAR_90.code, `A contact angle of ${q(angleDeg, "deg")} is close to 90°, where the result is proportional to a small cos θ (${formatValue(Math.cos(angleDeg * Math.PI / 180))}); treat it as very uncertain.`, fields);
}
/** Attached to a result whose liquid was entered by hand: its hazards are unknown to the table. */
var OTHER_LIQUID_CAUTION = {
	code: "OTHER_LIQUID_HAZARD",
	text: "The liquid's hazards are not known to this calculator: read its safety data sheet before handling it."
};
/** The assumptions every capillary result shares. */
var STATIC_ASSUMPTIONS = [
	"Static equilibrium: the liquid has stopped moving.",
	"Clean liquid and clean surfaces: no surfactant, oil or dirt.",
	"Air density neglected against the liquid density (0.12 % for water)."
];
/** The capillary length step ℓc = √(σ/(ρ·g)), id `capillary-length`, for a warning to point at. */
function capillaryLengthStep(sigma, rho, g, lc, label = "Capillary length") {
	return {
		id: "capillary-length",
		label,
		formula: "ℓc = √(σ / (ρ·g))",
		substituted: `√(${q(sigma, "N/m")} / (${q(rho, "kg/m3")} × ${q(g, "m/s2")}))`,
		value: lc,
		unit: "m",
		source: "de Gennes, Brochard-Wyart & Quéré (2004) Capillarity and Wetting Phenomena"
	};
}
/** A solution with the liquid's hazard (if it has one) attached to the result's cautions. */
function solved(parts, liquid) {
	return liquid?.hazard !== void 0 ? {
		...parts,
		hazards: [liquid.hazard]
	} : parts;
}
/** The gravity assumption, naming the value used. */
function gravityAssumption(g) {
	return g === 9.80665 ? `Standard gravity, ${coef(STANDARD_GRAVITY)} m/s².` : `Local gravity of ${q(g, "m/s2")} as entered.`;
}
/**
* Runs a formula whose argument names differ from the calculator's input ids, renaming the field of
* any CalcInputError it throws so that the form marks the right input.
*/
function withFieldNames(names, compute) {
	try {
		return compute();
	} catch (err) {
		if (err instanceof CalcInputError) throw new CalcInputError(err.issues.map((i) => ({
			...i,
			field: names[i.field] ?? i.field
		})));
		throw err;
	}
}
// packages/calc-core/dist/calculators/absorption-coefficient.js
/**
* The least correlation coefficient r of the fit for a rate to be reported. ASTM C1585: data
* between 1 min and 6 h with r below 0.98 do not give an initial rate (from memory). EN ISO 15148
* prints no such number that we could see; the same limit is applied to it as our threshold.
*/
var MIN_CORRELATION = .98;
/** EN ISO 15148's test runs 24 h (from memory). */
var EN_TEST_DURATION_S = 86400;
var EN = "EN ISO 15148:2002";
var ASTM = "ASTM C1585";
var FITTED = [
	"absorptionCoefficient",
	"absorptionCoefficientPerRootHour",
	"sorptivity",
	"intercept",
	"rSquared"
];
var RATES = [
	"absorptionCoefficient",
	"absorptionCoefficientPerRootHour",
	"sorptivity",
	"intercept"
];
/** The readings input: time (s) and the specimen's mass (kg), the dry weighing first at time 0. */
var readingsInput = {
	id: "readings",
	label: "Readings",
	kind: "table",
	help: "Time since the face touched the water and the specimen's mass, one row per weighing; the first row is the mass at time 0.",
	columns: [{
		id: "time",
		label: "Time",
		kind: "time",
		min: 0,
		max: 2592e3,
		display: {
			si: "min",
			us: "min"
		},
		increasing: true
	}, {
		id: "mass",
		label: "Mass",
		kind: "mass",
		min: 0,
		max: 100,
		display: {
			si: "g",
			us: "g"
		}
	}],
	minRows: 5,
	maxRows: 200,
	default: [
		{
			time: 0,
			mass: 1.84213
		},
		{
			time: 300,
			mass: 1.84581
		},
		{
			time: 1200,
			mass: 1.84893
		},
		{
			time: 3600,
			mass: 1.8535
		},
		{
			time: 7200,
			mass: 1.85804
		},
		{
			time: 14400,
			mass: 1.86437
		},
		{
			time: 28800,
			mass: 1.87329
		},
		{
			time: 86400,
			mass: 1.89567
		}
	]
};
function readings(inputs) {
	const v = inputs.readings;
	if (!Array.isArray(v)) throw new Error("input readings is not a resolved table");
	return v;
}
var withheld = () => Object.fromEntries(FITTED.map((id) => [id, null]));
function solve$8(inputs) {
	const method = choice(inputs, "method");
	const rows = readings(inputs);
	const area = num(inputs, "faceArea");
	const rhoW = num(inputs, "waterDensity");
	if (rows[0]?.time !== 0) throw new CalcInputError({
		field: "readings.0.time",
		code: "NO_ZERO_READING",
		message: "Readings, row 1, time: the first row must be the specimen's mass at time 0, before it touches the water"
	});
	const source = method === "astm-c1585" ? ASTM : EN;
	const points = absorptionPoints(rows.map((r) => ({
		time: r.time,
		mass: r.mass
	})), area);
	const chosen = points.filter((_, i) => i > 0 && inFitWindow(method, rows[i]?.time));
	const [from, to] = FIT_WINDOW_S[method];
	const windowText = method === "astm-c1585" ? `readings from ${q(from, "s")} (1 min) to ${q(to, "s")} (6 h)` : "every reading after the one at time 0";
	const last = rows[rows.length - 1];
	const lastGain = points[points.length - 1]?.y ?? 0;
	const working = [{
		id: "gain",
		label: "Mass gained per area of the wet face, last reading",
		formula: "Δm/A = (m_t − m_0) / A",
		substituted: `(${q(last.mass, "kg", 6)} − ${q(rows[0].mass, "kg", 6)}) / ${q(area, "m2")}`,
		value: lastGain,
		unit: "kg/m2",
		source
	}, {
		id: "points",
		label: "Readings in the fit",
		formula: method === "astm-c1585" ? "1 min ≤ t ≤ 6 h" : "t > 0",
		substituted: `${chosen.length} of ${rows.length} rows: ${windowText}`,
		value: chosen.length,
		unit: "1",
		source
	}];
	const base = {
		working,
		band: null,
		assumptions: [
			"One face in water, the sides sealed, so water enters through the face area given only.",
			"The mass at time 0 is the specimen before it touched the water; every later mass is weighed after the surface water is wiped off.",
			"Water density as given for the sorptivity; the absorption coefficient does not use it.",
			"The line is fitted by ordinary least squares to Δm/A against √t (every point weighted alike)."
		]
	};
	const outputs = (values) => ({
		...withheld(),
		...values,
		pointsInFit: chosen.length
	});
	if (chosen.length < 3) return {
		...base,
		outputs: outputs({}),
		warnings: [warning("TOO_FEW_POINTS_IN_FIT", `Only ${chosen.length} reading${chosen.length === 1 ? "" : "s"} fall in the fit (${windowText}); at least 3 are needed to judge a straight line, so no rate is given.`, ["readings", "method"], {
			step: "points",
			withholds: [...FITTED]
		})]
	};
	const fit = fitLine(chosen);
	const r = Math.sign(fit.slope) * Math.sqrt(fit.rSquared);
	working.push({
		id: "sums",
		label: "Sums of the fit (x = √t in √s, y = Δm/A in kg/m²)",
		formula: "Sxx = Σ(x − x̄)², Sxy = Σ(x − x̄)(y − ȳ)",
		substituted: `n = ${fit.n}, x̄ = ${formatValue(fit.meanX)}, ȳ = ${formatValue(fit.meanY)}, Sxx = ${formatValue(fit.sxx)}, Sxy = ${formatValue(fit.sxy)}, Syy = ${formatValue(fit.syy)}`,
		value: fit.sxx,
		unit: "1",
		source: "Ordinary least squares"
	}, {
		id: "slope",
		label: "Water absorption coefficient (slope of the line)",
		formula: "A_w = Sxy / Sxx",
		substituted: `${formatValue(fit.sxy)} / ${formatValue(fit.sxx)}`,
		value: fit.slope,
		unit: "kg/(m2*s^0.5)",
		source
	}, {
		id: "intercept",
		label: "Intercept of the line at t = 0",
		formula: "a = ȳ − A_w·x̄",
		substituted: `${formatValue(fit.meanY)} − ${formatValue(fit.slope)} × ${formatValue(fit.meanX)}`,
		value: fit.intercept,
		unit: "kg/m2",
		source
	}, {
		id: "r-squared",
		label: "Coefficient of determination",
		formula: "R² = Sxy² / (Sxx·Syy)",
		substituted: `${formatValue(fit.sxy)}² / (${formatValue(fit.sxx)} × ${formatValue(fit.syy)}); r = ${formatValue(r)}`,
		value: fit.rSquared,
		unit: "1",
		source: "Ordinary least squares"
	});
	const warnings = [];
	if (!(fit.slope > 0)) {
		warnings.push(warning("NO_UPTAKE", `The fitted line does not rise (slope ${q(fit.slope, "kg/(m2*s^0.5)")}): the specimen took up no water over the readings in the fit, so no absorption rate is given. Check that the masses are the specimen's own and in time order.`, ["readings"], {
			step: "slope",
			withholds: [...RATES]
		}));
		return {
			...base,
			outputs: outputs({ rSquared: fit.rSquared }),
			warnings
		};
	}
	if (r < .98) {
		warnings.push(warning("NOT_LINEAR", `The readings in the fit do not lie on a straight line against √t (r = ${formatValue(r, 3)}, below ${MIN_CORRELATION}; R² = ${formatValue(fit.rSquared, 3)}): ${method === "astm-c1585" ? "ASTM C1585 gives no initial rate for such data" : "the wetting front may have reached the top of the specimen, or the sides leak"}, so no rate is given.`, ["readings"], {
			step: "r-squared",
			withholds: [...RATES]
		}));
		return {
			...base,
			outputs: outputs({ rSquared: fit.rSquared }),
			warnings
		};
	}
	const sorptivity = fit.slope / rhoW;
	working.push({
		id: "per-root-hour",
		label: "Water absorption coefficient per root hour",
		formula: `A_w,h = 60·A_w  (√3600 s = 60 √s)`,
		substituted: `60 × ${q(fit.slope, "kg/(m2*s^0.5)")} = ${q(fit.slope * 60, "kg/(m2*h^0.5)")}`,
		value: fit.slope,
		unit: "kg/(m2*s^0.5)",
		source: EN
	}, {
		id: "sorptivity",
		label: "Sorptivity",
		formula: "S = A_w / ρ_w",
		substituted: `${q(fit.slope, "kg/(m2*s^0.5)")} / ${q(rhoW, "kg/m3")}`,
		value: sorptivity,
		unit: "m/s^0.5",
		source: ASTM
	});
	if (method === "en-iso-15148" && last.time < EN_TEST_DURATION_S) warnings.push(warning("SHORTER_THAN_TEST", `The last reading is at ${q(last.time / 3600, "h")}; EN ISO 15148 runs the test for 24 h (from memory). The coefficient stands for the readings given; state the test's length with it.`, ["readings"], { step: "points" }));
	return {
		...base,
		outputs: outputs({
			absorptionCoefficient: fit.slope,
			absorptionCoefficientPerRootHour: fit.slope,
			sorptivity,
			intercept: fit.intercept,
			rSquared: fit.rSquared
		}),
		warnings
	};
}
var calculator$10 = {
	id: "absorption-coefficient",
	title: "Water absorption coefficient",
	summary: "A material's water absorption coefficient and sorptivity from a partial-immersion test: the straight line of mass gained per area of the wet face against the square root of time.",
	inputs: [
		{
			id: "method",
			label: "Test method",
			kind: "choice",
			default: "en-iso-15148",
			options: [{
				value: "en-iso-15148",
				label: "EN ISO 15148 (building materials)",
				help: "Every weighing after the dry one enters the fit."
			}, {
				value: "astm-c1585",
				label: "ASTM C1585 (concrete)",
				help: "The initial rate: readings from 1 min to 6 h enter the fit."
			}]
		},
		readingsInput,
		{
			id: "faceArea",
			label: "Area of the face in water",
			kind: "area",
			default: .01,
			min: 1e-4,
			max: 1,
			display: {
				si: "cm2",
				us: "in2"
			},
			help: "The wetted face only, its sides sealed."
		},
		{
			id: "waterDensity",
			label: "Density of water",
			kind: "density",
			default: 1e3,
			min: 950,
			max: 1050,
			help: "Turns the coefficient into a sorptivity; ASTM C1585 takes 0.001 g/mm³ (1000 kg/m³, from memory)."
		}
	],
	outputs: [
		{
			id: "absorptionCoefficient",
			label: "Water absorption coefficient A_w",
			kind: "absorptionCoefficient",
			display: {
				si: "kg/(m2*s^0.5)",
				us: "lb/(ft2*h^0.5)"
			}
		},
		{
			id: "absorptionCoefficientPerRootHour",
			label: "Water absorption coefficient per √h",
			kind: "absorptionCoefficient",
			display: {
				si: "kg/(m2*h^0.5)",
				us: "lb/(ft2*h^0.5)"
			}
		},
		{
			id: "sorptivity",
			label: "Sorptivity S",
			kind: "sorptivity",
			display: {
				si: "mm/s^0.5",
				us: "in/min^0.5"
			}
		},
		{
			id: "intercept",
			label: "Intercept of the line at t = 0",
			kind: "arealMass",
			help: "Water taken up at once by open pores of the face."
		},
		{
			id: "rSquared",
			label: "Coefficient of determination R²",
			kind: "dimensionless"
		},
		{
			id: "pointsInFit",
			label: "Readings in the fit",
			kind: "dimensionless"
		}
	],
	headline: {
		rules: [{
			output: "absorptionCoefficient",
			text: "The readings give a water absorption coefficient of about {value}."
		}],
		missing: "absorption coefficient"
	},
	warnings: [
		{
			code: "TOO_FEW_POINTS_IN_FIT",
			summary: `Fewer than 3 readings in the method's fit window: no rate is given.`
		},
		{
			code: "NO_UPTAKE",
			summary: "The fitted line does not rise: no rate is given."
		},
		{
			code: "NOT_LINEAR",
			summary: `The fit's correlation coefficient is below ${MIN_CORRELATION} (ASTM C1585, from memory; our threshold for EN ISO 15148): no rate is given.`
		},
		{
			code: "SHORTER_THAN_TEST",
			summary: "An EN ISO 15148 test whose last reading is before 24 h."
		}
	],
	solve: solve$8,
	checkTable: (input, value) => tableIssues(input, value)
};
// packages/calc-core/dist/calculators/shared-texts.js
/** References that bear on a result only with water chosen. */
var WITH_WATER = [{
	input: "liquid",
	values: ["water"]
}];
var TANAKA_SOURCE = "Tanaka M., Girard G., Davis R., Peuto A., Bignell N. (2001) Recommended table for the density of water between 0 °C and 40 °C based on recent experimental reports, Metrologia 38, 301–309";
var KELL_SOURCE = "Kell G. S. (1975) Density, thermal expansivity, and compressibility of liquid water from 0° to 150 °C, J. Chem. Eng. Data 20, 97–105";
var ESTIMATE_CAUTION = {
	code: "ESTIMATE_ONLY",
	text: "Results are estimates from idealised published formulas. They do not replace a site investigation or the judgement of a licensed professional working under local codes."
};
var CLEAN_SURFACES_CAUTION = {
	code: "CLEAN_SURFACES",
	text: "Surface tension falls sharply with contamination (detergents, oils, organic matter) and contact angles depend on the cleanliness of the surface; the values assume clean liquids and surfaces."
};
var DAMP_CAUTION = {
	code: "DAMP_DIAGNOSIS",
	text: "A rise in a tube, slot or crack is not the height of rising damp in a wall: in a wall, evaporation from its faces limits how high water climbs, and salts, the pore structure and the history of the masonry change it. Diagnose damp from gravimetric moisture profiles of drilled samples (BS 6576, BRE Digest 245) before specifying damp-proofing or remedial work.",
	source: "BS 6576 and BRE Digest 245 (from memory)"
};
var FROST_CAUTION = {
	code: "FROST_HEAVE",
	text: "Water drawn up by capillarity feeds ice lenses in frost-susceptible soils (silts, fine sands, some clays); where the capillary zone reaches the frost depth, frost heave of slabs, pavements and shallow foundations is possible."
};
var FOUNDATIONS_CAUTION = {
	code: "FOUNDATIONS",
	text: "Capillary water changes the moisture and effective stress of the soil under foundations and slabs; foundation design needs a geotechnical investigation."
};
var WATER_REFERENCES = [
	{
		id: "iapws-r1-76",
		citation: "IAPWS R1-76(2014), Revised Release on Surface Tension of Ordinary Water Substance",
		usedFor: "surface tension of water from 0.01 °C to the critical point",
		basis: "printed",
		appliesWhen: WITH_WATER
	},
	{
		id: "tanaka-2001",
		citation: TANAKA_SOURCE,
		usedFor: "density of air-free water at 101 325 Pa, 0–40 °C",
		basis: "printed",
		appliesWhen: WITH_WATER
	},
	{
		id: "kell-1975",
		citation: KELL_SOURCE,
		usedFor: "density of water at 1 atm above 40 °C (above 100 °C a liquid held at 1 atm)",
		basis: "printed",
		appliesWhen: WITH_WATER
	}
];
var VISCOSITY_REFERENCE = {
	id: "iapws-sr6-08",
	citation: "IAPWS SR6-08 (2011), Supplementary Release on Properties of Liquid Water at 0.1 MPa",
	usedFor: "viscosity of water",
	basis: "printed",
	appliesWhen: WITH_WATER
};
var LIQUID_TABLE_REFERENCES = [
	{
		id: "jasper-1972",
		citation: "Jasper J. J. (1972) The surface tension of pure liquid compounds, J. Phys. Chem. Ref. Data 1, 841–1009",
		usedFor: "surface tension of the organic liquids in the table",
		basis: "printed",
		appliesWhen: [{
			input: "liquid",
			values: liquids.filter((l) => l.surfaceTension.source.startsWith("Jasper")).map((l) => l.id)
		}]
	},
	{
		id: "adamson-gast-1997",
		citation: "Adamson A. W., Gast A. P. (1997) Physical Chemistry of Surfaces, 6th ed., Wiley",
		usedFor: "surface tension of mercury",
		basis: "printed",
		appliesWhen: [{
			input: "liquid",
			values: ["mercury"]
		}]
	},
	{
		id: "crc-handbook",
		citation: "CRC Handbook of Chemistry and Physics",
		usedFor: "densities and viscosities of the liquids in the table at 20 °C (recalled from the handbook, not read from a printed page here: from memory)",
		basis: "from memory",
		appliesWhen: [{
			input: "liquid",
			values: liquids.map((l) => l.id)
		}]
	}
];
var RAYLEIGH_REFERENCE = {
	id: "rayleigh-1915",
	citation: "Lord Rayleigh (1915) On the theory of the capillary tube, Proc. R. Soc. Lond. A 92, 184–195",
	usedFor: "the meniscus-weight correction r/3 and the small-bore condition (the slot form is derived from the same geometry)",
	basis: "printed"
};
// packages/calc-core/dist/calculators/absorption-coefficient.texts.js
var texts$10 = {
	cautions: [
		ESTIMATE_CAUTION,
		{
			code: "LABORATORY_RESULT",
			text: "The coefficient describes the specimens tested under the method's conditions. Weathering, salts, coatings and moisture already in a wall change how much water it takes up; judge a building from its own survey."
		},
		DAMP_CAUTION
	],
	references: [
		{
			id: "en-iso-15148",
			citation: "EN ISO 15148:2002 (+A1:2016) Hygrothermal performance of building materials and products — Determination of water absorption coefficient by partial immersion",
			usedFor: "A_w as the slope of Δm/A against √t, stated per √s and per √h (clause details from memory)",
			basis: "from memory"
		},
		{
			id: "astm-c1585",
			citation: "ASTM C1585 Standard Test Method for Measurement of Rate of Absorption of Water by Hydraulic-Cement Concretes",
			usedFor: "I = Δm/(a·ρ_w) against √t, the initial rate from 1 min to 6 h, and no rate when r < 0.98 (clause details from memory)",
			basis: "from memory"
		},
		{
			id: "hall-1989",
			citation: "Hall C. (1989) Water sorptivity of mortars and concretes: a review, Magazine of Concrete Research 41, 51–61",
			usedFor: "sorptivity as the slope of the absorbed volume per area against √t (citation from memory)",
			basis: "from memory"
		}
	]
};
// packages/calc-core/dist/formulas/contact-angle.js
/**
* Wilhelmy plate read for the contact angle, with buoyancy: the measured force is
* F = σ·P·cos θ − ρ·g·w·t·h, so cos θ = (F + ρ·g·w·t·h) / (σ·P), P = 2(w + t).
* The returned cos θ is not clamped: a value outside [−1, 1] means the force is more than the
* surface tension can give (a surface tension set too low, or a tare error), and no angle exists.
*/
function plateForceTerms(args) {
	const force = finiteResult("force", args.force);
	const sigma = positive("surfaceTension", args.surfaceTension);
	const rho = positive("density", args.density);
	const w = positive("plateWidth", args.plateWidth);
	const t = nonNegative("plateThickness", args.plateThickness);
	const h = nonNegative("immersionDepth", args.immersionDepth);
	const g = positive("gravity", args.gravity ?? 9.80665);
	const perimeter = 2 * (w + t);
	const buoyancy = rho * g * w * t * h;
	return {
		perimeter,
		buoyancy,
		cosTheta: finiteResult("cos θ", (force + buoyancy) / (sigma * perimeter))
	};
}
/** Degrees, 0–180, from a cosine inside [−1, 1]. */
function acosDeg(cos) {
	return Math.acos(cos) * 180 / Math.PI;
}
/** How far an angle below 90° moves, in degrees, when its cosine is 1 % lower. */
function onePercentShift(angleDeg) {
	return acosDeg(.99 * Math.cos(angleDeg * Math.PI / 180)) - angleDeg;
}
// packages/calc-core/dist/calculators/angle-reading.js
/**
* The angle of a cosine from a measurement, or null outside −1…1. A cosine past ±1 by no more than
* rounding (1e-12) is the fully wetted or fully non-wetted case itself and reads as 0° or 180°.
*/
function angleOf(cos) {
	if (Math.abs(cos) > 1 + 1e-12) return null;
	return acosDeg(Math.max(-1, Math.min(1, cos)));
}
var ANGLE_POORLY_DETERMINED = {
	code: "ANGLE_POORLY_DETERMINED",
	summary: `An angle below 15°, where a 1 % error in the measurement or the surface tension moves it by about 2° or more.`
};
/**
* The ANGLE_POORLY_DETERMINED warning for an angle below the threshold, else null.
* @param measured what was measured, for the sentence ("force", "rise")
*/
function poorlyDetermined(angleDeg, measured, fields, step) {
	if (angleDeg >= 15) return null;
	return warning(ANGLE_POORLY_DETERMINED.code, `At ${q(angleDeg, "deg")} the cosine is close to 1 and changes slowly with the angle: a 1 % error in the ${measured} or the surface tension moves the angle by ${formatValue(onePercentShift(angleDeg), 2)}°. Report it as "below 15°" unless both are known better than that.`, fields, { step });
}
// packages/calc-core/dist/calculators/contact-angle-from-force.js
var cycle = [{
	input: "readings",
	values: ["cycle"]
}];
var WILHELMY = "Wilhelmy 1863, with the buoyancy of the immersed plate";
function noAngle(cos, which, field, step, withholds) {
	const why = cos > 1 ? `the plate is pulled down harder than the liquid's surface tension can pull it, even fully wetted: the surface tension entered is too low for this liquid (a contaminated or mis-identified liquid), or the balance was not tared with the plate hanging in air` : `the plate is pushed up harder than the surface tension can push it, even fully non-wetted: check the tare, the sign of the force and the surface tension`;
	return warning(field === "force" ? "NO_ANGLE_FOR_FORCE" : "NO_ANGLE_FOR_RECEDING_FORCE", `No ${which} exists for this reading: cos θ comes out at ${formatValue(cos)}, outside −1 to 1, because ${why}.`, [field, "surfaceTension"], {
		step,
		withholds
	});
}
function solve$7(inputs) {
	const both = choice(inputs, "readings") === "cycle";
	const F = num(inputs, "force");
	const sigma = num(inputs, "surfaceTension");
	const rho = num(inputs, "density");
	const w = num(inputs, "plateWidth");
	const t = num(inputs, "plateThickness");
	const h = num(inputs, "immersionDepth");
	const g = num(inputs, "gravity");
	const plate = {
		surfaceTension: sigma,
		density: rho,
		plateWidth: w,
		plateThickness: t,
		immersionDepth: h,
		gravity: g
	};
	const adv = plateForceTerms({
		...plate,
		force: F
	});
	const working = [
		{
			id: "perimeter",
			label: "Wetted length of the plate",
			formula: "P = 2·(w + t)",
			substituted: `2 × (${q(w, "m")} + ${q(t, "m")})`,
			value: adv.perimeter,
			unit: "m",
			source: "geometry of the plate"
		},
		{
			id: "buoyancy",
			label: "Buoyancy of the immersed part of the plate",
			formula: "B = ρ·g·w·t·h",
			substituted: `${q(rho, "kg/m3")} × ${q(g, "m/s2")} × ${q(w, "m")} × ${q(t, "m")} × ${q(h, "m")}`,
			value: adv.buoyancy,
			unit: "N",
			source: "Archimedes: the displaced liquid of the immersed depth"
		},
		{
			id: "cos",
			label: both ? "Cosine of the advancing angle (immersion force)" : "Cosine of the contact angle",
			formula: "cos θ = (F + B) / (σ·P)",
			substituted: `(${q(F, "N")} + ${q(adv.buoyancy, "N")}) / (${q(sigma, "N/m")} × ${q(adv.perimeter, "m")})`,
			value: adv.cosTheta,
			unit: "1",
			source: WILHELMY
		}
	];
	const warnings = [];
	const angle = angleOf(adv.cosTheta);
	if (angle !== null) working.push({
		id: "angle",
		label: both ? "Advancing contact angle" : "Contact angle",
		formula: "θ = arccos(cos θ)",
		substituted: `arccos(${formatValue(adv.cosTheta, 6)})`,
		value: angle,
		unit: "deg",
		source: WILHELMY
	});
	else warnings.push(noAngle(adv.cosTheta, both ? "advancing angle" : "contact angle", "force", "cos", ["contactAngleDeg", "hysteresisDeg"]));
	let receding = null;
	let recCos = null;
	if (both) {
		const Fr = num(inputs, "recedingForce");
		recCos = plateForceTerms({
			...plate,
			force: Fr
		}).cosTheta;
		working.push({
			id: "receding-cos",
			label: "Cosine of the receding angle (withdrawal force)",
			formula: "cos θ_r = (F_r + B) / (σ·P)",
			substituted: `(${q(Fr, "N")} + ${q(adv.buoyancy, "N")}) / (${q(sigma, "N/m")} × ${q(adv.perimeter, "m")})`,
			value: recCos,
			unit: "1",
			source: WILHELMY
		});
		receding = angleOf(recCos);
		if (receding !== null) working.push({
			id: "receding-angle",
			label: "Receding contact angle",
			formula: "θ_r = arccos(cos θ_r)",
			substituted: `arccos(${formatValue(recCos, 6)})`,
			value: receding,
			unit: "deg",
			source: WILHELMY
		});
		else warnings.push(noAngle(recCos, "receding angle", "recedingForce", "receding-cos", ["recedingAngleDeg", "hysteresisDeg"]));
	}
	let hysteresis = null;
	if (angle !== null && receding !== null) {
		if (receding > angle) warnings.push(warning("RECEDING_ABOVE_ADVANCING", `The receding angle (${q(receding, "deg")}) comes out above the advancing angle (${q(angle, "deg")}): the withdrawal force is below the immersion force, which a plate cannot give. The two readings look swapped, so no hysteresis is given.`, ["force", "recedingForce"], {
			step: "receding-angle",
			withholds: ["hysteresisDeg"]
		}));
		else {
			hysteresis = angle - receding;
			working.push({
				id: "hysteresis",
				label: "Contact-angle hysteresis",
				formula: "Δθ = θ_a − θ_r",
				substituted: `${q(angle, "deg")} − ${q(receding, "deg")}`,
				value: hysteresis,
				unit: "deg",
				source: "definition"
			});
		}
	}
	for (const [value, field, step] of [[
		angle,
		"force",
		"angle"
	], [
		receding,
		"recedingForce",
		"receding-angle"
	]]) {
		const poor = value === null ? null : poorlyDetermined(value, "force", [field, "surfaceTension"], step);
		if (poor !== null) warnings.push(poor);
	}
	return solved({
		outputs: {
			contactAngleDeg: angle,
			recedingAngleDeg: both ? receding : null,
			hysteresisDeg: both ? hysteresis : null,
			cosTheta: adv.cosTheta,
			buoyancy: adv.buoyancy,
			wettedLength: adv.perimeter
		},
		working,
		warnings,
		band: null,
		assumptions: [
			"The force is net of the weight of the plate in air (the balance tared with the plate hanging above the liquid).",
			"The immersion depth is that of the lower edge below the undisturbed liquid surface when the force was read.",
			"A thin rectangular plate of the test material, uniform on all four sides, wetted along its whole perimeter 2·(w + t).",
			both ? "The immersion force gives the advancing angle and the withdrawal force the receding angle, both read while the plate moves slowly at a steady speed." : "A single reading taken as the contact angle of the plate at rest (for a moving plate, the advancing or receding angle).",
			"The surface tension and density are those of the liquid as used: a clean liquid, air density neglected.",
			gravityAssumption(g)
		]
	});
}
function forceInput$1(id, label, defaultN, help, when) {
	return quantityInput("force", id, label, defaultN, [-.1, .1], {
		help,
		display: {
			si: "mN",
			us: "mN"
		},
		...when !== void 0 ? { appliesWhen: when } : {}
	});
}
var calculator$9 = {
	id: "contact-angle-from-force",
	title: "Contact angle from a Wilhelmy plate force",
	summary: "The contact angle of a liquid on a plate of the test material, from the force measured on the plate at a known immersion depth, with buoyancy; advancing and receding angles and their hysteresis from an immersion and a withdrawal reading.",
	inputs: [
		{
			id: "readings",
			label: "Readings",
			kind: "choice",
			default: "single",
			options: [{
				value: "single",
				label: "One force reading"
			}, {
				value: "cycle",
				label: "Immersion and withdrawal forces (advancing and receding)"
			}]
		},
		forceInput$1("force", "Measured force on the plate", .0014, "Net of the plate weight in air; positive pulls the plate down. With two readings, the force while immersing."),
		forceInput$1("recedingForce", "Force while withdrawing", .0022, "Net of the plate weight in air, read while the plate is drawn out.", cycle),
		quantityInput("surfaceTension", "surfaceTension", "Surface tension of the liquid", .0728, [.001, 1], { help: "Measured on the same liquid (e.g. with a roughened platinum plate, ASTM D1331 Method C)." }),
		quantityInput("density", "density", "Liquid density", 998.2, [100, 25e3]),
		quantityInput("length", "plateWidth", "Plate width w", .02, [1e-4, .2], { display: MM }),
		quantityInput("length", "plateThickness", "Plate thickness t", 2e-4, [0, .01], { display: MM }),
		quantityInput("length", "immersionDepth", "Immersion depth h of the lower edge", .002, [0, .05], {
			help: "Zero when the force is read with the lower edge level with the liquid surface.",
			display: MM
		}),
		gravityInput()
	],
	outputs: [
		{
			id: "contactAngleDeg",
			label: "Contact angle (advancing, with two readings)",
			kind: "angle"
		},
		{
			id: "recedingAngleDeg",
			label: "Receding contact angle",
			kind: "angle"
		},
		{
			id: "hysteresisDeg",
			label: "Contact-angle hysteresis",
			kind: "angle"
		},
		{
			id: "cosTheta",
			label: "cos θ from the force balance",
			kind: "dimensionless",
			help: "Outside −1 to 1 no contact angle gives the force measured."
		},
		{
			id: "buoyancy",
			label: "Buoyancy correction",
			kind: "force",
			display: {
				si: "mN",
				us: "mN"
			}
		},
		{
			id: "wettedLength",
			label: "Wetted length",
			kind: "length",
			display: MM
		}
	],
	headline: {
		rules: [{
			output: "contactAngleDeg",
			text: "The liquid meets the plate at a contact angle of about {value}."
		}],
		missing: "contact angle"
	},
	warnings: [
		{
			code: "NO_ANGLE_FOR_FORCE",
			summary: "cos θ from the force is outside −1 to 1: no contact angle gives this reading (surface tension too low, or a tare error)."
		},
		{
			code: "NO_ANGLE_FOR_RECEDING_FORCE",
			summary: "cos θ from the withdrawal force is outside −1 to 1: no receding angle gives this reading."
		},
		{
			code: "RECEDING_ABOVE_ADVANCING",
			summary: "The withdrawal force is below the immersion force: the readings look swapped, no hysteresis is given."
		},
		ANGLE_POORLY_DETERMINED
	],
	solve: solve$7
};
// packages/calc-core/dist/calculators/contact-angle-from-force.texts.js
var texts$9 = {
	cautions: [
		ESTIMATE_CAUTION,
		OTHER_LIQUID_CAUTION,
		{
			code: "PLATE_PREPARATION",
			text: "The angle belongs to the plate as tested: its surface must be clean, uniform on every side and free of swelling or dissolution in the liquid; a trace of contamination on the plate or the liquid changes the angle more than any correction."
		},
		CLEAN_SURFACES_CAUTION
	],
	references: [
		{
			id: "wilhelmy-1863",
			citation: "Wilhelmy L. (1863) Ueber die Abhängigkeit der Capillaritäts-Constanten des Alkohols von Substanz und Gestalt des benetzten festen Körpers, Ann. Phys. 195, 177–217",
			usedFor: "the plate force balance F = σ·P·cos θ − B",
			basis: "printed"
		},
		{
			id: "astm-d1331",
			citation: "ASTM D1331-20, Standard Test Methods for Surface and Interfacial Tension of Solutions of Paints, Solvents, Solutions of Surface-Active Agents, and Related Materials",
			usedFor: "Method C, surface tension by the Wilhelmy plate read at zero depth with no buoyancy correction (scope as published); this calculator runs the same balance backwards for the angle, with buoyancy",
			basis: "printed"
		},
		{
			id: "iso-19403",
			citation: "ISO 19403 series, Paints and varnishes — Wettability (ISO 19403-1:2017 general principles; ISO 19403-6:2024 dynamic advancing and receding angles by changing the volume of a drop)",
			usedFor: "the optical contact-angle methods (as its published scope says) that a force-derived angle is compared with; the force method itself is not in the series",
			basis: "printed"
		}
	]
};
// packages/calc-core/dist/formulas/frost.js
/** The share finer than 0.02 mm above which a soil is frost-susceptible, by uniformity. */
var CASAGRANDE_THRESHOLDS = {
	/** Cu below this is "very uniform". */
	uniformBelowCu: 5,
	/** Cu above this is "non-uniform". */
	nonUniformAboveCu: 15,
	/** Share finer than 0.02 mm, very uniform soils. */
	uniformShare: .1,
	/** Share finer than 0.02 mm, non-uniform soils (and, conservatively, those between). */
	nonUniformShare: .03
};
/**
* Casagrande's grain-size criterion.
* @param finesShare mass share finer than 0.02 mm, 0–1
* @param uniformity coefficient of uniformity Cu = D60/D10, ≥ 1
*/
function casagrandeCriterion(finesShare, uniformity) {
	const share = nonNegative("finesShare", finesShare);
	if (share > 1) throw new CalcInputError({
		field: "finesShare",
		code: "SHARE_ABOVE_ONE",
		message: "finesShare is a share of the mass, 0 to 1"
	});
	const cu = finite("uniformity", uniformity);
	if (cu < 1) throw new CalcInputError({
		field: "uniformity",
		code: "CU_BELOW_ONE",
		message: "Cu = D60/D10 cannot be below 1"
	});
	const t = CASAGRANDE_THRESHOLDS;
	const gradation = cu < t.uniformBelowCu ? "very uniform" : cu > t.nonUniformAboveCu ? "non-uniform" : "intermediate";
	const threshold = gradation === "very uniform" ? t.uniformShare : t.nonUniformShare;
	return {
		gradation,
		threshold,
		susceptible: share > threshold
	};
}
/**
* The frost-design soil group of the US Army Corps of Engineers' pavement practice [from memory]:
* F1 gravelly soils with 3–10 % finer than 0.02 mm; F2 gravelly soils with 10–20 %, sands with
* 3–15 %; F3 gravelly soils over 20 %, sands (not very fine silty sands) over 15 %, clays with
* PI > 12; F4 all silts, very fine silty sands over 15 %, clays with PI < 12, varved clays.
* @param kind the soil's kind
* @param finesShare mass share finer than 0.02 mm, 0–1
* @param plasticityIndex PI in percentage points, for clays
*/
function frostGroup(kind, finesShare, plasticityIndex) {
	const p = nonNegative("finesShare", finesShare) * 100;
	switch (kind) {
		case "gravel": return p <= 3 ? "NFS" : p <= 10 ? "F1" : p <= 20 ? "F2" : "F3";
		case "sand": return p <= 3 ? "NFS" : p <= 15 ? "F2" : "F3";
		case "very-fine-silty-sand": return p <= 3 ? "NFS" : p <= 15 ? "F2" : "F4";
		case "silt":
		case "varved-clay": return "F4";
		case "clay":
			if (plasticityIndex === void 0) throw new CalcInputError({
				field: "plasticityIndex",
				code: "REQUIRED",
				message: "a clay needs its plasticity index"
			});
			return nonNegative("plasticityIndex", plasticityIndex) > 12 ? "F3" : "F4";
	}
}
/**
* Whether the capillary fringe above a water table reaches the frost line: the top of the fringe
* is the water-table depth less the capillary rise; it reaches when that is at or above the frost
* depth. Depths below the finished surface, m.
* @returns the gap in m between the frost line and the top of the fringe (≤ 0: it reaches)
*/
function fringeGapBelowFrostLine(args) {
	const wt = positive("waterTableDepth", args.waterTableDepth);
	const fd = positive("frostDepth", args.frostDepth);
	return wt - nonNegative("capillaryRise", args.capillaryRise) - fd;
}
// packages/calc-core/dist/calculators/hazen.js
var HAZEN_SOURCE = "Terzaghi & Peck (1948): C = 0.1–0.5 cm² (10–50 mm²), as given by Smith, Elements of Soil Mechanics (from memory)";
/** The band over the whole published range of Hazen's constant. */
var HAZEN_BASIS = {
	input: "hazenC",
	low: HAZEN_C_RANGE_M2.min,
	high: HAZEN_C_RANGE_M2.max,
	source: HAZEN_SOURCE
};
/** The `hazenC` input, m², defaulting to the middle of the published range. */
function hazenCInput(help, when) {
	return quantityInput("area", "hazenC", "Hazen's constant C", 3e-5, [HAZEN_C_RANGE_M2.min, HAZEN_C_RANGE_M2.max], {
		spread: {
			low: HAZEN_C_RANGE_M2.min,
			high: HAZEN_C_RANGE_M2.max,
			source: HAZEN_SOURCE
		},
		help,
		display: {
			si: "cm2",
			us: "cm2"
		},
		...when !== void 0 ? { appliesWhen: when } : {}
	});
}
/** The working step of h_c = C/(e·D10): C in m², D10 in m, the rise in m. */
function hazenRiseStep(id, label, c, e, d10, value) {
	return {
		id,
		label,
		formula: "h_c = C / (e·D10)",
		substituted: `${q(c, "m2")} / (${formatValue(e)} × ${q(d10, "m")})`,
		value,
		unit: "m",
		source: "Hazen, as given by Terzaghi & Peck (1948) (from memory)"
	};
}
// packages/calc-core/dist/calculators/frost-screening.js
var CASAGRANDE = "Casagrande 1931 grain-size criterion (from memory, common practice)";
var GROUPS = "frost-design soil groups of US Army Corps of Engineers pavement practice (from memory)";
/** No. 200 sieve, the sand/fines boundary of ASTM D2487: Hazen's relation was drawn from coarser soils. */
var NO200_SIEVE_M$1 = 75e-6;
/** Our band around a Casagrande threshold, in share of mass: about the repeatability of a hydrometer test. */
var NEAR_THRESHOLD = .01;
var hazen = [{
	input: "riseFrom",
	values: ["hazen"]
}];
var measured = [{
	input: "riseFrom",
	values: ["measured"]
}];
var clay = [{
	input: "soilKind",
	values: ["clay"]
}];
var GROUP_INDEX = {
	NFS: 0,
	F1: 1,
	F2: 2,
	F3: 3,
	F4: 4
};
var KIND_LABEL = {
	gravel: "Gravelly soil",
	sand: "Sand (not a very fine silty sand)",
	"very-fine-silty-sand": "Very fine silty sand",
	silt: "Silt",
	clay: "Clay",
	"varved-clay": "Varved clay or other fine-grained banded sediment"
};
function solve$6(inputs) {
	const share = num(inputs, "finesShare");
	const cu = num(inputs, "uniformity");
	const kind = choice(inputs, "soilKind");
	const pi = kind === "clay" ? num(inputs, "plasticityIndex") : void 0;
	const frostDepth = num(inputs, "frostDepth");
	const wt = num(inputs, "waterTableDepth");
	const fromHazen = choice(inputs, "riseFrom") === "hazen";
	const d10 = fromHazen ? num(inputs, "d10") : 0;
	const e = fromHazen ? num(inputs, "voidRatio") : 0;
	const c = fromHazen ? num(inputs, "hazenC") : 0;
	const crit = casagrandeCriterion(share, cu);
	const group = frostGroup(kind, share, pi);
	const groupSusceptible = group !== "NFS";
	const susceptible = crit.susceptible || groupSusceptible;
	const fine = fromHazen && d10 < NO200_SIEVE_M$1;
	const tableInFrost = wt <= frostDepth;
	const riseAt = (cValue) => fromHazen ? hazenCapillaryRise({
		d10,
		voidRatio: e,
		c: cValue
	}) : num(inputs, "capillaryRise");
	const evaluate = (cValue) => {
		const rise = riseAt(cValue);
		const gap = fringeGapBelowFrostLine({
			waterTableDepth: wt,
			frostDepth,
			capillaryRise: rise
		});
		return {
			capillaryRise: fine ? null : rise,
			fringeGap: fine ? null : gap,
			fringeReachesFrostLine: tableInFrost ? 1 : fine ? null : gap <= 0 ? 1 : 0
		};
	};
	const nominal = evaluate(c);
	const outputs = {
		frostSusceptible: susceptible ? 1 : 0,
		frostGroup: GROUP_INDEX[group],
		...nominal
	};
	const pct = (x) => `${formatValue(x * 100)} %`;
	const working = [{
		id: "casagrande",
		label: `Casagrande criterion: ${crit.gradation} soil, threshold ${pct(crit.threshold)} finer than 0.02 mm`,
		formula: `susceptible if share finer than 0.02 mm > ${pct(CASAGRANDE_THRESHOLDS.uniformShare)} (Cu < ${CASAGRANDE_THRESHOLDS.uniformBelowCu}) or > ${pct(CASAGRANDE_THRESHOLDS.nonUniformShare)} (otherwise)`,
		substituted: `Cu = ${formatValue(cu)}, share = ${pct(share)} ${crit.susceptible ? ">" : "≤"} ${pct(crit.threshold)}`,
		value: crit.susceptible ? 1 : 0,
		unit: "1",
		source: CASAGRANDE
	}, {
		id: "group",
		label: `Frost-design soil group: ${group === "NFS" ? "not frost-susceptible (NFS)" : group}`,
		formula: "0 = NFS, 1–4 = F1–F4 (F4 most susceptible)",
		substituted: `${KIND_LABEL[kind]}, ${pct(share)} finer than 0.02 mm${pi !== void 0 ? `, PI = ${formatValue(pi)}` : ""}`,
		value: GROUP_INDEX[group],
		unit: "1",
		source: GROUPS
	}];
	if (fromHazen && !fine) working.push(hazenRiseStep("rise", "Capillary rise above the water table", c, e, d10, riseAt(c)));
	else if (!fromHazen) working.push({
		id: "rise",
		label: "Capillary rise above the water table (measured)",
		formula: "h_c",
		substituted: q(riseAt(c), "m"),
		value: riseAt(c),
		unit: "m",
		source: "measured for this soil"
	});
	if (!fine) {
		const gap = nominal.fringeGap ?? 0;
		working.push({
			id: "fringe",
			label: "Gap between the frost line and the top of the capillary fringe",
			formula: "D_w − h_c − D_f (zero or less: the fringe reaches the frost line)",
			substituted: `${q(wt, "m")} − ${q(riseAt(c), "m")} − ${q(frostDepth, "m")}`,
			value: gap,
			unit: "m",
			source: "depths below the finished surface; the fringe top taken as sharp (common practice)"
		});
	}
	const band = fromHazen && !fine ? bandOver([HAZEN_BASIS], nominal, (v) => evaluate(v.hazenC ?? c)) : null;
	const warnings = [];
	if (fine) warnings.push(warning("FINE_GRAINED_SOIL", `D10 of ${q(d10 * 1e3, "mm")} is finer than the No. 200 sieve (0.075 mm): Hazen's relation was drawn from sands and does not hold here, so no capillary rise or gap is given${tableInFrost ? "" : ", nor whether the fringe reaches the frost line"}. Enter a measured capillary rise instead.`, ["d10", "riseFrom"], { withholds: tableInFrost ? ["capillaryRise", "fringeGap"] : [
		"capillaryRise",
		"fringeGap",
		"fringeReachesFrostLine"
	] }));
	if (tableInFrost) warnings.push(warning("WATER_TABLE_WITHIN_FROST_DEPTH", `The water table (${q(wt, "m")} down) is within the frost depth (${q(frostDepth, "m")}): free water freezes in place, so ${susceptible ? "ice lenses and heave are to be expected in this frost-susceptible soil" : "even a soil that screens as not susceptible can heave"}. Lower the water table or design for it.`, ["waterTableDepth", "frostDepth"]));
	else if (nominal.fringeReachesFrostLine === 0 && (band?.outputs.fringeReachesFrostLine?.high ?? 0) >= 1) warnings.push(warning("FRINGE_MAY_REACH_FROST_LINE", `With Hazen's constant at the top of its published range (0.5 cm²) the capillary fringe reaches the frost line: the gap of ${q(nominal.fringeGap ?? 0, "m")} is not secure.`, ["waterTableDepth", "hazenC"], { step: "fringe" }));
	if (crit.gradation === "intermediate") warnings.push(warning("INTERMEDIATE_GRADATION", `Cu = ${formatValue(cu)} lies between the very uniform (Cu < ${CASAGRANDE_THRESHOLDS.uniformBelowCu}) and non-uniform (Cu > ${CASAGRANDE_THRESHOLDS.nonUniformAboveCu}) soils the criterion names, where it gives no threshold of its own; the lower ${pct(CASAGRANDE_THRESHOLDS.nonUniformShare)} is applied, which may call a soil susceptible that a frost-heave test would pass.`, ["uniformity"], { step: "casagrande" }));
	if (Math.abs(share - crit.threshold) <= NEAR_THRESHOLD) warnings.push(warning("NEAR_THRESHOLD", `${pct(share)} finer than 0.02 mm is within one percentage point of the ${pct(crit.threshold)} threshold: the verdict turns on the precision of the hydrometer analysis; treat the soil as susceptible until a frost-heave test (ASTM D5918) says otherwise.`, ["finesShare"], { step: "casagrande" }));
	if (crit.susceptible !== groupSusceptible) warnings.push(warning("SCREENS_DISAGREE", `The Casagrande criterion says ${crit.susceptible ? "susceptible" : "not susceptible"} but the soil group (${group}) says ${groupSusceptible ? "susceptible" : "not susceptible"}: the screen takes the soil as frost-susceptible. Check the soil description against the grading.`, [
		"soilKind",
		"finesShare",
		"uniformity"
	], { step: "group" }));
	return solved({
		outputs,
		working,
		warnings,
		band,
		assumptions: [
			"A screen by grain size only: Casagrande's criterion and the frost-design soil groups, both recalled from the published practice, not seen printed here.",
			"The soil is the one within the frost depth and below it down to the water table; layered ground needs each layer checked.",
			"A static water table at its highest seasonal level; the top of the capillary fringe taken as a sharp line.",
			fromHazen ? "The capillary rise by Hazen's empirical formula, with the band over the published range of its constant." : "The capillary rise as measured for this soil.",
			"The frost depth as given, from the local code or climate records."
		]
	});
}
var calculator$8 = {
	id: "frost-screening",
	title: "Frost-susceptibility screening of a soil",
	summary: "Whether a soil under a slab or pavement is frost-susceptible by Casagrande's grain-size criterion and the frost-design soil groups, and whether its capillary fringe reaches the frost line from the water table (Hazen's estimate or a measured rise).",
	inputs: [
		quantityInput("dimensionless", "finesShare", "Share by mass finer than 0.02 mm", .05, [0, 1], { help: "From the grading (hydrometer) curve, as a fraction: 0.05 for 5 %." }),
		quantityInput("dimensionless", "uniformity", "Coefficient of uniformity Cu = D60/D10", 20, [1, 1e3]),
		{
			id: "soilKind",
			label: "Soil",
			kind: "choice",
			default: "sand",
			options: Object.keys(KIND_LABEL).map((value) => ({
				value,
				label: KIND_LABEL[value]
			}))
		},
		quantityInput("dimensionless", "plasticityIndex", "Plasticity index PI", 15, [0, 100], {
			help: "In percentage points; decides F3 (PI above 12) or F4 for a clay.",
			appliesWhen: clay
		}),
		quantityInput("length", "frostDepth", "Frost depth below the finished surface", 1, [.05, 5], {
			help: "From the local code or climate records for the site.",
			display: {
				si: "m",
				us: "ft"
			}
		}),
		quantityInput("length", "waterTableDepth", "Depth of the water table below the finished surface", 2.5, [.01, 50], {
			help: "Its highest seasonal level.",
			display: {
				si: "m",
				us: "ft"
			}
		}),
		{
			id: "riseFrom",
			label: "Capillary rise",
			kind: "choice",
			default: "hazen",
			options: [{
				value: "hazen",
				label: "Estimate by Hazen's formula from D10"
			}, {
				value: "measured",
				label: "Enter a measured capillary rise"
			}]
		},
		quantityInput("length", "d10", "Effective grain size D10", 8e-5, [1e-6, .02], {
			help: "The sieve size that 10 % of the soil by mass passes.",
			display: MM,
			appliesWhen: hazen
		}),
		quantityInput("dimensionless", "voidRatio", "Void ratio e", .6, [.1, 3], { appliesWhen: hazen }),
		hazenCInput("Published range 0.1–0.5 cm²; the band always spans all of it.", hazen),
		quantityInput("length", "capillaryRise", "Measured capillary rise", .5, [0, 50], {
			display: {
				si: "m",
				us: "ft"
			},
			appliesWhen: measured
		})
	],
	outputs: [
		{
			id: "frostSusceptible",
			label: "Frost-susceptible (1 yes, 0 no)",
			kind: "dimensionless",
			help: "Yes when either the Casagrande criterion or the soil group says so."
		},
		{
			id: "frostGroup",
			label: "Frost-design soil group (0 = NFS, 1–4 = F1–F4)",
			kind: "dimensionless"
		},
		{
			id: "capillaryRise",
			label: "Capillary rise above the water table",
			kind: "length",
			display: {
				si: "m",
				us: "ft"
			}
		},
		{
			id: "fringeGap",
			label: "Gap between the frost line and the capillary fringe",
			kind: "length",
			help: "Zero or negative: the fringe reaches the frost line.",
			display: {
				si: "m",
				us: "ft"
			}
		},
		{
			id: "fringeReachesFrostLine",
			label: "Capillary fringe reaches the frost line (1 yes, 0 no)",
			kind: "dimensionless"
		}
	],
	headline: {
		rules: [{
			output: "fringeReachesFrostLine",
			text: "Capillary water can reach the frost line in this soil.",
			atOrBelow: "Capillary water stays below the frost line in this soil."
		}, {
			output: "frostSusceptible",
			text: "This soil screens as frost-susceptible.",
			atOrBelow: "This soil does not screen as frost-susceptible."
		}],
		missing: "frost screening answer"
	},
	warnings: [
		{
			code: "FINE_GRAINED_SOIL",
			summary: "D10 is finer than 0.075 mm, outside the sands Hazen's relation was drawn from: no estimated rise."
		},
		{
			code: "WATER_TABLE_WITHIN_FROST_DEPTH",
			summary: "The water table is at or above the frost line."
		},
		{
			code: "FRINGE_MAY_REACH_FROST_LINE",
			summary: "The fringe stops below the frost line at the chosen C but reaches it at the top of Hazen's published range."
		},
		{
			code: "INTERMEDIATE_GRADATION",
			summary: "Cu between 5 and 15, where the criterion gives no threshold of its own; the 3 % threshold is applied."
		},
		{
			code: "NEAR_THRESHOLD",
			summary: "The share finer than 0.02 mm is within one percentage point of the threshold."
		},
		{
			code: "SCREENS_DISAGREE",
			summary: "The Casagrande criterion and the soil group disagree; the soil is taken as susceptible."
		}
	],
	solve: solve$6
};
// packages/calc-core/dist/calculators/frost-screening.texts.js
var texts$8 = {
	cautions: [
		ESTIMATE_CAUTION,
		FROST_CAUTION,
		FOUNDATIONS_CAUTION,
		{
			code: "FROST_TESTING_AND_DESIGN",
			text: "A grain-size screen is not a frost-heave test: where it matters, have the soil tested for frost heave and thaw weakening (ASTM D5918), and design foundations against frost heave to EN ISO 13793 or the code that applies at the site, with the frost depth it gives.",
			source: "ASTM D5918; EN ISO 13793"
		}
	],
	references: [
		{
			id: "casagrande-1931",
			citation: "Casagrande A. (1931) Discussion on frost heaving, Highway Research Board Proceedings 11",
			usedFor: "the grain-size criterion: 3 % finer than 0.02 mm for non-uniform soils, 10 % for very uniform soils",
			basis: "from memory"
		},
		{
			id: "usace-frost-groups",
			citation: "US Army Corps of Engineers, frost-design soil classification for pavements (groups F1–F4)",
			usedFor: "the frost-design soil groups by soil kind, share finer than 0.02 mm and plasticity index",
			basis: "from memory"
		},
		{
			id: "astm-d5918",
			citation: "ASTM D5918, Standard Test Methods for Frost Heave and Thaw Weakening Susceptibility of Soils",
			usedFor: "the laboratory test this screen defers to",
			basis: "printed"
		},
		{
			id: "en-iso-13793",
			citation: "EN ISO 13793, Thermal performance of buildings — Thermal design of foundations to avoid frost heave",
			usedFor: "the design of foundations against frost heave that this screen defers to",
			basis: "printed"
		},
		{
			id: "terzaghi-peck-1948",
			citation: "Terzaghi K., Peck R. B. (1948) Soil Mechanics in Engineering Practice, Wiley",
			usedFor: "Hazen's formula h_c = C/(e·D10) and the range of C, 0.1–0.5 cm² (recalled, not seen printed here)",
			basis: "from memory"
		}
	]
};
// packages/calc-core/dist/calculators/interface-pressure.js
var oneRadius = [{
	input: "shape",
	values: [
		"drop",
		"film-bubble",
		"jet"
	]
}];
var whenGeneral = [{
	input: "shape",
	values: ["general"]
}];
var whenPore = [{
	input: "shape",
	values: ["pore"]
}];
function radiusInput(id, label, defaultM, when) {
	return quantityInput("length", id, label, defaultM, [1e-9, 1], {
		display: MM,
		...when !== void 0 ? { appliesWhen: when } : {}
	});
}
var FORMULAS = {
	drop: "Δp = 2·σ / R",
	"film-bubble": "Δp = 4·σ / R",
	jet: "Δp = σ / R",
	general: "Δp = σ·(1/R₁ + 1/R₂)",
	pore: "P_c = 2·σ·cos θ / r"
};
function solve$5(inputs) {
	const shape = choice(inputs, "shape");
	const liquid = resolveLiquid(inputs, { density: true });
	const sigma = liquid.surfaceTension;
	const rho = liquid.density;
	const g = num(inputs, "gravity");
	const angle = shape === "pore" ? resolveContactAngle(inputs, liquid.id) : null;
	const pressureAt = (theta) => {
		switch (shape) {
			case "drop": {
				const R = num(inputs, "radius");
				return {
					value: laplacePressure({
						surfaceTension: sigma,
						r1: R
					}),
					substituted: `2 × ${q(sigma, "N/m")} / ${q(R, "m")}`
				};
			}
			case "film-bubble": {
				const R = num(inputs, "radius");
				return {
					value: bubblePressure({
						surfaceTension: sigma,
						radius: R
					}),
					substituted: `4 × ${q(sigma, "N/m")} / ${q(R, "m")}`
				};
			}
			case "jet": {
				const R = num(inputs, "radius");
				return {
					value: laplacePressure({
						surfaceTension: sigma,
						r1: R,
						r2: Infinity
					}),
					substituted: `${q(sigma, "N/m")} / ${q(R, "m")}`
				};
			}
			case "general": {
				const r1 = num(inputs, "r1");
				const r2 = num(inputs, "r2");
				return {
					value: laplacePressure({
						surfaceTension: sigma,
						r1,
						r2
					}),
					substituted: `${q(sigma, "N/m")} × (1/${q(r1, "m")} + 1/${q(r2, "m")})`
				};
			}
			case "pore": {
				const r = num(inputs, "poreRadius");
				return {
					value: poreEntryPressure({
						surfaceTension: sigma,
						contactAngleDeg: theta,
						poreRadius: r
					}),
					substituted: `2 × ${q(sigma, "N/m")} × cos ${q(theta, "deg")} / ${q(r, "m")}`
				};
			}
		}
	};
	const evaluate = (theta) => {
		const p = pressureAt(theta).value;
		return {
			pressure: p,
			pressureHead: p / (rho * g)
		};
	};
	const theta = angle?.angleDeg ?? 0;
	const lc = capillaryLength({
		surfaceTension: sigma,
		density: rho,
		gravity: g
	});
	const flattened = shape === "drop" && num(inputs, "radius") >= lc;
	const computed = evaluate(theta);
	const outputs = flattened ? {
		pressure: null,
		pressureHead: null
	} : computed;
	const p = computed.pressure ?? 0;
	const working = [...liquid.working, ...angle?.working ?? []];
	if (shape === "drop") working.push(capillaryLengthStep(sigma, rho, g, lc));
	if (!flattened) working.push({
		id: "pressure",
		label: shape === "pore" ? "Capillary (entry) pressure of the pore" : "Pressure across the interface",
		formula: FORMULAS[shape],
		substituted: pressureAt(theta).substituted,
		value: p,
		unit: "Pa",
		source: "Young–Laplace equation (Young 1805, Laplace 1806)"
	}, {
		id: "head",
		label: "As a head of the liquid",
		formula: "Δp / (ρ·g)",
		substituted: `${q(p, "Pa")} / (${q(rho, "kg/m3")} × ${q(g, "m/s2")})`,
		value: computed.pressureHead ?? 0,
		unit: "m",
		source: "hydrostatics, p = ρ·g·h"
	});
	const warnings = [];
	if (flattened) {
		const R = num(inputs, "radius");
		warnings.push(warning("SHAPE_NOT_SPHERICAL", `A radius of ${q(R, "m")} is at least the capillary length (${q(lc, "m")}): a resting drop of this size is flattened by gravity and one radius does not describe it (Bond number ${formatValue((R / lc) ** 2)}), so no pressure is given.`, ["radius"], {
			step: "capillary-length",
			withholds: ["pressure", "pressureHead"]
		}));
	}
	if (shape === "pore") {
		if (theta > 90) warnings.push(warning("PORE_NON_WETTING", "The liquid does not wet the pore (θ > 90°): the negative value is the pressure needed to push the liquid in.", ANGLE_FIELDS, { step: "pressure" }));
		const near = nearNinety(theta);
		if (near !== null) warnings.push({
			...near,
			step: "pressure"
		});
	}
	const band = bandOver(angle?.basis ?? [], outputs, (v) => evaluate(v.contactAngleDeg ?? theta));
	const shapes = {
		drop: "A spherical drop: one radius of curvature, the same everywhere.",
		"film-bubble": "A thin-film bubble with two surfaces of the same radius.",
		jet: "A long cylindrical jet: one radius, the other infinite.",
		general: "The two principal radii of curvature as entered, at the point of interest.",
		pore: "A cylindrical pore of the radius entered, with a hemispherical meniscus at the contact angle."
	};
	return solved({
		outputs,
		working,
		warnings,
		band,
		assumptions: [
			...STATIC_ASSUMPTIONS,
			shapes[shape],
			liquid.assumption,
			...angle !== null ? [angle.assumption] : [],
			gravityAssumption(g)
		]
	}, liquid);
}
var calculator$7 = {
	id: "interface-pressure",
	title: "Pressure across a curved interface",
	summary: "Young–Laplace pressure difference across a drop, a soap bubble, a jet or any surface with two radii, and the capillary (air-entry) pressure of a pore.",
	inputs: [
		{
			id: "shape",
			label: "Interface",
			kind: "choice",
			default: "drop",
			options: [
				{
					value: "drop",
					label: "Drop, or gas bubble inside a liquid (one surface)",
					help: "Δp = 2σ/R"
				},
				{
					value: "film-bubble",
					label: "Soap bubble (thin film, two surfaces)",
					help: "Δp = 4σ/R"
				},
				{
					value: "jet",
					label: "Cylindrical jet or thread",
					help: "Δp = σ/R"
				},
				{
					value: "general",
					label: "Any surface, two principal radii",
					help: "Δp = σ(1/R₁ + 1/R₂)"
				},
				{
					value: "pore",
					label: "Air-entry pressure of a pore",
					help: "P_c = 2σ cos θ / r"
				}
			]
		},
		...liquidInputs({ density: true }),
		radiusInput("radius", "Radius", .001, oneRadius),
		radiusInput("r1", "First principal radius R₁", .001, whenGeneral),
		radiusInput("r2", "Second principal radius R₂", .002, whenGeneral),
		{
			...radiusInput("poreRadius", "Pore radius", 1e-6, whenPore),
			max: .01,
			display: {
				si: "um",
				us: "in"
			}
		},
		...contactAngleInputs({
			presetIds: [
				"water-mineral-grains",
				"water-clean-glass",
				"mercury-glass"
			],
			defaultPreset: "water-mineral-grains",
			when: whenPore
		}),
		gravityInput()
	],
	outputs: [{
		id: "pressure",
		label: "Pressure difference",
		kind: "pressure",
		help: "Higher on the concave side; for a pore, the suction the meniscus holds.",
		display: {
			si: "kPa",
			us: "psi"
		}
	}, {
		id: "pressureHead",
		label: "As a head of the liquid",
		kind: "length",
		help: "Δp/(ρ g): for a pore, the equivalent capillary rise."
	}],
	headline: {
		rules: [{
			when: whenPore,
			output: "pressure",
			text: "Air needs about {value} to push into a pore {input.poreRadius} in radius.",
			atOrBelow: "The liquid needs about {value} to be pushed into a pore {input.poreRadius} in radius."
		}, {
			output: "pressure",
			text: "The pressure on the inner, concave side is about {value} higher."
		}],
		missing: "pressure"
	},
	warnings: [
		{
			code: "SHAPE_NOT_SPHERICAL",
			summary: "A drop at least as large as the capillary length is flattened by gravity."
		},
		{
			code: "PORE_NON_WETTING",
			summary: "θ > 90°: the liquid must be pushed into the pore."
		},
		CONTACT_ANGLE_NEAR_90
	],
	solve: solve$5
};
// packages/calc-core/dist/calculators/interface-pressure.texts.js
var texts$7 = {
	cautions: [
		ESTIMATE_CAUTION,
		{
			code: "REAL_PORES",
			text: "A soil or building material has a distribution of pore sizes and shapes; its air-entry value comes from a measured water-retention curve, and the single-pore figure is a guide to the order of magnitude."
		},
		CLEAN_SURFACES_CAUTION
	],
	references: [
		{
			id: "young-laplace",
			citation: "Young T. (1805) Phil. Trans. R. Soc. 95, 65–87; Laplace P. S. (1806) Traité de mécanique céleste, suppl. au livre X",
			usedFor: "Δp = σ(1/R₁ + 1/R₂) and its drop, bubble, jet and pore forms",
			basis: "printed"
		},
		...WATER_REFERENCES,
		...LIQUID_TABLE_REFERENCES
	]
};
// packages/calc-core/dist/formulas/rising-damp.js
/** The fraction of the steady height taken as "steady state reached" (our choice: 95 %). */
var STEADY_FRACTION = .95;
/**
* Steady state of rising damp in a wall, sharp-front model (see the header for the balance).
* @returns heights in m, volumes per metre in m³/m, flow in m³/(m·s), times in s
*/
function risingDampSteadyState(args) {
	const S = positive("sorptivity", args.sorptivity);
	const b = positive("wallThickness", args.wallThickness);
	const e = positive("evaporationRate", args.evaporationRate);
	const theta = positive("wetWaterContent", args.wetWaterContent);
	const n = positive("dryingFaces", args.dryingFaces);
	const steadyHeight = S * Math.sqrt(b / (2 * n * e * theta));
	const waterHeld = theta * b * steadyHeight;
	const flow = n * e * steadyHeight;
	return {
		steadyHeight,
		waterHeld,
		flow,
		timeConstant: b * theta / (2 * n * e),
		residenceTime: waterHeld / flow
	};
}
/**
* Time for the wet front to reach a fraction f (0–1) of its steady height from a dry wall:
* t_f = −τ·ln(1 − f²), s.
*/
function timeToFraction(fraction, timeConstant) {
	return -timeConstant * Math.log(1 - fraction * fraction);
}
// packages/calc-core/dist/calculators/rising-damp-height.js
var HALL_HOFF = "Hall & Hoff 2007, Proc. R. Soc. A 463, 1871–1884 (form from memory)";
var DERIVED = "sharp-front water balance of Hall & Hoff 2007, derived here";
/** Our threshold: below one wall thickness the wet zone is not tall against the wall, see the warning. */
var SHALLOW_RATIO = 1;
/** Heights above this are rarely seen in walls (common practice); the model then points at its inputs. */
var TALL_HEIGHT_M = 2;
var DAY_S = 86400;
function solve$4(inputs) {
	const S = num(inputs, "sorptivity");
	const b = num(inputs, "wallThickness");
	const e = num(inputs, "evaporationRate");
	const theta = num(inputs, "wetWaterContent");
	const both = choice(inputs, "dryingFaces") === "both";
	const n = both ? 2 : 1;
	const r = risingDampSteadyState({
		sorptivity: S,
		wallThickness: b,
		evaporationRate: e,
		wetWaterContent: theta,
		dryingFaces: n
	});
	const tSteady = timeToFraction(STEADY_FRACTION, r.timeConstant);
	const pct = formatValue(STEADY_FRACTION * 100);
	const working = [
		{
			id: "steady-height",
			label: "Steady-state height of the wet front",
			formula: "h_ss = S·√(b / (2·n·e·θ_w))",
			substituted: `${q(S, "m/s^0.5")} × √(${q(b, "m")} / (2 × ${n} × ${q(e, "m/s")} × ${formatValue(theta)}))`,
			value: r.steadyHeight,
			unit: "m",
			source: `${HALL_HOFF}; n drying faces, derived here`
		},
		{
			id: "water-held",
			label: "Water held in the wet zone, per metre of wall",
			formula: "W = θ_w·b·h_ss",
			substituted: `${formatValue(theta)} × ${q(b, "m")} × ${q(r.steadyHeight, "m")}`,
			value: r.waterHeld,
			unit: "m3/m",
			source: DERIVED
		},
		{
			id: "flow",
			label: "Flow through the wall at steady state, per metre of wall",
			formula: "Q = n·e·h_ss = b·S² / (2·θ_w·h_ss)",
			substituted: `${n} × ${q(e, "m/s")} × ${q(r.steadyHeight, "m")}`,
			value: r.flow,
			unit: "m3/(m*s)",
			source: DERIVED
		},
		{
			id: "time-constant",
			label: "Time constant of the approach to steady state",
			formula: "τ = b·θ_w / (2·n·e); h(t) = h_ss·√(1 − exp(−t/τ))",
			substituted: `${q(b, "m")} × ${formatValue(theta)} / (2 × ${n} × ${q(e, "m/s")})`,
			value: r.timeConstant,
			unit: "s",
			source: DERIVED
		},
		{
			id: "time-to-steady",
			label: `Time for a dry wall to wet to ${pct} % of the steady height`,
			formula: `t = −τ·ln(1 − f²), f = ${formatValue(STEADY_FRACTION)}`,
			substituted: `−${q(r.timeConstant, "s")} × ln(1 − ${formatValue(STEADY_FRACTION)}²)`,
			value: tSteady,
			unit: "s",
			source: DERIVED
		},
		{
			id: "residence",
			label: "Mean time water spends in the wall",
			formula: "t_r = W / Q = 2·τ",
			substituted: `${q(r.waterHeld, "m3/m")} / ${q(r.flow, "m3/(m*s)")}`,
			value: r.residenceTime,
			unit: "s",
			source: DERIVED
		}
	];
	const warnings = [];
	if (r.steadyHeight < SHALLOW_RATIO * b) warnings.push(warning("WET_ZONE_NOT_TALL", `The steady height (${q(r.steadyHeight, "m")}) is less than the wall thickness (${q(b, "m")}): the model treats the water content as even across the wall, which needs a wet zone tall against the thickness. Read the height as an order of magnitude.`, ["wallThickness", "evaporationRate"], { step: "steady-height" }));
	if (r.steadyHeight > TALL_HEIGHT_M) warnings.push(warning("HEIGHT_ABOVE_OBSERVED", `A steady height of ${q(r.steadyHeight, "m")} is above the ${q(TALL_HEIGHT_M, "m")} that rising damp rarely exceeds in practice (common practice). Such heights come from a very low evaporation rate (impermeable finishes, buried or sheltered faces) or a high sorptivity: check both, and look for other sources of water.`, ["evaporationRate", "sorptivity"], { step: "steady-height" }));
	if (tSteady > 3652.5 * DAY_S) warnings.push(warning("SLOW_APPROACH", `The wall takes ${formatValue(tSteady / (365.25 * DAY_S))} years to approach steady state: seasons change the evaporation rate long before then, so the wall is never at the steady height; the steady figures are a limit, not a state to expect.`, [
		"evaporationRate",
		"wallThickness",
		"wetWaterContent"
	], { step: "time-to-steady" }));
	return solved({
		outputs: {
			steadyHeight: r.steadyHeight,
			waterHeld: r.waterHeld,
			dailyFlow: r.flow,
			timeToSteady: tSteady,
			timeConstant: r.timeConstant,
			residenceTime: r.residenceTime
		},
		working,
		warnings,
		band: null,
		assumptions: [
			"A sharp wet front: the wall below it is at the wet water content θw, above it dry (Hall & Hoff sharp-front model).",
			"A uniform wall of one material standing in a permanent water supply at its base; no damp-proof course.",
			`Evaporation at a steady rate e per unit area from ${both ? "both faces" : "one face"} over the whole wet height, none above it.`,
			"Gravity neglected against capillary suction, and the sorptivity that of the masonry as built (mortar joints included).",
			"No salts: salts crystallising near the faces change the evaporation and the sorptivity."
		]
	});
}
var calculator$6 = {
	id: "rising-damp-height",
	title: "Height of rising damp in a wall",
	summary: "The evaporation-limited height that water rises to in a wall standing in wet ground, by the sharp-front model of Hall & Hoff (2007), with the water the wall holds, the daily flow through it and how long it takes to get there.",
	inputs: [
		quantityInput("sorptivity", "sorptivity", "Sorptivity of the masonry", .001 / Math.sqrt(60), [1e-6, .002], { help: "Water absorbed per unit area against the square root of time, from a partial-immersion test of the masonry." }),
		quantityInput("length", "wallThickness", "Wall thickness", .35, [.05, 3], { display: {
			si: "mm",
			us: "in"
		} }),
		quantityInput("evaporationRate", "evaporationRate", "Evaporation rate from each drying face", .001 / DAY_S, [1e-10, 1e-6], { help: "Volume of water leaving per unit area of wall face, as a depth of water per day." }),
		quantityInput("dimensionless", "wetWaterContent", "Wet water content θw", .2, [.01, .6], { help: "Volume fraction of the masonry filled with water in the wet zone (the capillary-saturated content, below the porosity)." }),
		{
			id: "dryingFaces",
			label: "The wall dries from",
			kind: "choice",
			default: "both",
			options: [{
				value: "both",
				label: "Both faces"
			}, {
				value: "one",
				label: "One face (the other sealed, rendered hard or buried)"
			}]
		}
	],
	outputs: [
		{
			id: "steadyHeight",
			label: "Steady-state height of rising damp",
			kind: "length",
			display: {
				si: "m",
				us: "ft"
			}
		},
		{
			id: "waterHeld",
			label: "Water held per metre of wall",
			kind: "volumePerLength"
		},
		{
			id: "dailyFlow",
			label: "Flow through the wall per metre",
			kind: "flowPerLength"
		},
		{
			id: "timeToSteady",
			label: `Time to reach ${STEADY_FRACTION * 100} % of the steady height`,
			kind: "time",
			help: "From a dry wall under a steady evaporation rate.",
			display: {
				si: "day",
				us: "day"
			}
		},
		{
			id: "timeConstant",
			label: "Time constant τ",
			kind: "time",
			display: {
				si: "day",
				us: "day"
			}
		},
		{
			id: "residenceTime",
			label: "Mean time water spends in the wall",
			kind: "time",
			display: {
				si: "day",
				us: "day"
			}
		}
	],
	headline: {
		rules: [{
			output: "steadyHeight",
			text: "Damp can rise to about {value} in this wall, where evaporation from its faces balances the water drawn up."
		}],
		missing: "steady height"
	},
	warnings: [
		{
			code: "WET_ZONE_NOT_TALL",
			summary: "The steady height is below the wall thickness, where an even water content across the wall is a poor approximation."
		},
		{
			code: "HEIGHT_ABOVE_OBSERVED",
			summary: "The steady height is above 2 m, which rising damp rarely reaches in practice (common practice)."
		},
		{
			code: "SLOW_APPROACH",
			summary: "More than ten years to approach steady state: the steady figures are a limit the wall does not reach."
		}
	],
	solve: solve$4
};
// packages/calc-core/dist/calculators/rising-damp-height.texts.js
var texts$6 = {
	cautions: [
		ESTIMATE_CAUTION,
		{
			code: "RISING_DAMP_DIAGNOSIS",
			text: "A calculated height is not a diagnosis. Leaks, rain penetration, condensation and hygroscopic salts wet walls more often than rising damp does: establish the source from gravimetric moisture profiles of drilled samples (BS 6576, BRE Digest 245) before specifying a damp-proof course, injection or any remedial work.",
			source: "BS 6576 and BRE Digest 245 (from memory)"
		},
		{
			code: "FINISHES_RAISE_DAMP",
			text: "Anything that lowers evaporation from the faces (cement renders, impermeable paints, tanking, raised ground or floor levels) raises the height water climbs to; removing breathable finishes can make rising damp worse, not better."
		},
		{
			code: "STRUCTURE_AND_HEALTH",
			text: "Persistently wet masonry loses strength and frost resistance and can rot embedded timber; mould from damp walls is a health risk. Have a surveyor or structural engineer assess the wall under local building regulations."
		}
	],
	references: [
		{
			id: "hall-hoff-2007",
			citation: "Hall C., Hoff W. D. (2007) Rising damp: capillary rise dynamics in walls, Proc. R. Soc. A 463, 1871–1884",
			usedFor: "the sharp-front model of rising damp and its steady height h_ss = S·(b/(2eθ_w))^½ (the form recalled, the paper not seen printed here); the water held, flow, time constant and time to steady state are derived here from the same balance",
			basis: "from memory"
		},
		{
			id: "hall-hoff-book",
			citation: "Hall C., Hoff W. D., Water Transport in Brick, Stone and Concrete, Taylor & Francis",
			usedFor: "sorptivity and the sharp-front description of capillary absorption",
			basis: "from memory"
		},
		{
			id: "bs-6576-bre-245",
			citation: "BS 6576, Code of practice for diagnosis of rising damp in walls of buildings; BRE Digest 245",
			usedFor: "diagnosis by gravimetric moisture profiles",
			basis: "from memory"
		}
	]
};
// packages/calc-core/dist/calculators/rise-common.js
/** Rayleigh's r/3 against 2ℓc²/r: r²/(6ℓc²) = 0.02 at r/ℓc = √0.12. */
var TUBE = {
	sizeId: "diameter",
	sizeSymbol: "d",
	riseFormula: "h = 4·σ·cos θ / (ρ·g·d)",
	correctionFormula: "δ = V_held / (π·r²); δ = r/3 at θ = 0",
	heldFormula: "R_m = r / cos θ, s = R_m·(1 − sin θ), V_cap = π·s²·(3·R_m − s) / 3, V_held = π·r²·s − V_cap",
	rise: (a) => jurinRise({
		...a,
		diameter: a.size
	}),
	correction: (size, angle) => meniscusGeometry({
		diameter: size,
		contactAngleDeg: angle
	}),
	riseSource: "Jurin 1718 (Jurin's law)",
	shape: "A round, uniform, vertical bore, open to the liquid below.",
	notSmallRatio: Math.sqrt(.12),
	codes: {
		notSmall: "BORE_NOT_SMALL",
		tooWide: "BORE_TOO_WIDE"
	},
	noun: "bore",
	ratioId: "radiusToCapillaryLength"
};
/** (1/2 − π/8)·w against 2ℓc²/w is 0.02 at (w/2)/ℓc = √(0.01 / (1/2 − π/8)). */
var SLOT = {
	sizeId: "gap",
	sizeSymbol: "w",
	riseFormula: "h = 2·σ·cos θ / (ρ·g·w)",
	correctionFormula: "δ = A_held / w; δ = (1/2 − π/8)·w at θ = 0",
	heldFormula: "R_m = (w/2) / cos θ, s = R_m·(1 − sin θ), φ = 90° − θ, A_seg = R_m²·(φ − sin φ·cos φ), A_held = w·s − A_seg",
	rise: (a) => slotRise({
		...a,
		gap: a.size
	}),
	correction: (size, angle) => slotMeniscusGeometry({
		gap: size,
		contactAngleDeg: angle
	}),
	riseSource: "Jurin's force balance per unit length of two parallel walls (common practice)",
	shape: "Two flat, parallel, vertical walls, long against the gap, open to the liquid below.",
	notSmallRatio: Math.sqrt(.01 / (.5 - Math.PI / 8)),
	codes: {
		notSmall: "GAP_NOT_SMALL",
		tooWide: "GAP_TOO_WIDE"
	},
	noun: "gap",
	ratioId: "halfGapToCapillaryLength"
};
/** Inputs of a rise calculator: liquid, contact angle, the bore or gap (m), gravity (m/s²). */
/** Outputs of a rise calculator: the rise and its corrected value (m), ℓc (m), half the size over ℓc. */
function riseOutputs(geometry, riseLabel, ratioLabel) {
	return [
		{
			id: "rise",
			label: riseLabel,
			kind: "length",
			helpBySign: {
				above: "Height above the free surface of the liquid outside.",
				atOrBelow: "Negative: the liquid is pushed down below the free surface outside."
			},
			display: MM
		},
		{
			id: "riseCorrected",
			label: "Rise with meniscus-weight correction",
			kind: "length",
			help: "To the bottom of the meniscus; only for a concave meniscus (θ ≤ 90°).",
			display: MM
		},
		{
			id: "capillaryLength",
			label: "Capillary length",
			kind: "length",
			display: MM
		},
		{
			id: geometry.ratioId,
			label: ratioLabel,
			kind: "dimensionless"
		}
	];
}
function riseInputs(sizeInput) {
	return [
		...liquidInputs({ density: true }),
		...contactAngleInputs({
			presetIds: ["water-clean-glass", "mercury-glass"],
			defaultPreset: "water-clean-glass"
		}),
		sizeInput,
		gravityInput()
	];
}
/** Solves a tube or slot rise: outputs in m (and the dimensionless size ratio), with working and warnings. */
function solveRise(geometry, inputs) {
	const liquid = resolveLiquid(inputs, { density: true });
	const angle = resolveContactAngle(inputs, liquid.id);
	const size = num(inputs, geometry.sizeId);
	const g = num(inputs, "gravity");
	const sigma = liquid.surfaceTension;
	const rho = liquid.density;
	const lc = capillaryLength({
		surfaceTension: sigma,
		density: rho,
		gravity: g
	});
	const ratio = size / 2 / lc;
	const tooWide = ratio >= 1;
	const evaluate = (theta) => {
		const rise = geometry.rise({
			surfaceTension: sigma,
			contactAngleDeg: theta,
			density: rho,
			size,
			gravity: g
		});
		return {
			rise: tooWide ? null : rise,
			riseCorrected: !tooWide && theta <= 90 ? rise - geometry.correction(size, theta).correction : null,
			capillaryLength: lc,
			[geometry.ratioId]: ratio
		};
	};
	const outputs = evaluate(angle.angleDeg);
	const rise = geometry.rise({
		surfaceTension: sigma,
		contactAngleDeg: angle.angleDeg,
		density: rho,
		size,
		gravity: g
	});
	const s = geometry.sizeSymbol;
	const working = [
		...liquid.working,
		...angle.working,
		capillaryLengthStep(sigma, rho, g, lc),
		{
			id: "size-ratio",
			label: `Half the ${geometry.noun} against the capillary length`,
			formula: `(${s}/2) / ℓc`,
			substituted: `${q(size / 2, "m")} / ${q(lc, "m")}`,
			value: ratio,
			unit: "1",
			source: "Rayleigh 1915 (the rise law and its correction need r ≪ ℓc)"
		}
	];
	if (outputs.rise !== null && outputs.rise !== void 0) working.push({
		id: "rise",
		label: geometry.sizeId === "diameter" ? "Rise, Jurin's law" : "Rise between parallel walls",
		formula: geometry.riseFormula,
		substituted: `${geometry.sizeId === "diameter" ? 4 : 2} × ${q(sigma, "N/m")} × cos ${q(angle.angleDeg, "deg")} / (${q(rho, "kg/m3")} × ${q(g, "m/s2")} × ${q(size, "m")})`,
		value: rise,
		unit: "m",
		source: geometry.riseSource
	});
	if (outputs.riseCorrected !== null && outputs.riseCorrected !== void 0) {
		const m = geometry.correction(size, angle.angleDeg);
		const tube = geometry.sizeId === "diameter";
		working.push({
			id: "meniscus-sag",
			label: "Meniscus radius and sag",
			formula: tube ? "R_m = r / cos θ, s = R_m·(1 − sin θ)" : "R_m = (w/2) / cos θ, s = R_m·(1 − sin θ)",
			substituted: `${tube ? "r" : "w/2"} = ${q(size / 2, "m")}, θ = ${q(angle.angleDeg, "deg")}: R_m = ${Number.isFinite(m.radius) ? q(m.radius, "m") : "∞ (flat)"}`,
			value: m.sag,
			unit: "m",
			source: "spherical (tube) or cylindrical (slot) meniscus, Rayleigh 1915"
		}, {
			id: "meniscus-held",
			label: tube ? "Liquid held above the lowest point of the meniscus" : "Liquid held above the lowest point, per unit length",
			formula: geometry.heldFormula,
			substituted: `s = ${q(m.sag, "m")}, ${s} = ${q(size, "m")}`,
			value: m.held,
			unit: tube ? "m3" : "m2",
			source: "geometry of the meniscus, derived here"
		}, {
			id: "meniscus-correction",
			label: "Meniscus-weight correction",
			formula: geometry.correctionFormula,
			substituted: tube ? `${q(m.held, "m3")} / (π × (${q(size / 2, "m")})²)` : `${q(m.held, "m2")} / ${q(size, "m")}`,
			value: m.correction,
			unit: "m",
			source: "Rayleigh 1915 (r/3 at θ = 0); the same geometry for θ > 0, derived here"
		}, {
			id: "rise-corrected",
			label: "Rise to the bottom of the meniscus, corrected",
			formula: "h − δ",
			substituted: `${q(rise, "m")} − ${q(m.correction, "m")}`,
			value: outputs.riseCorrected,
			unit: "m",
			source: "Rayleigh 1915"
		});
	}
	const warnings = [];
	const fields = [geometry.sizeId];
	if (tooWide) warnings.push(warning(geometry.codes.tooWide, `Half the ${geometry.noun} is ${formatValue(ratio, 2)} times the capillary length (${q(lc, "m")}): the meniscus is flattened by gravity and neither ${geometry.sizeId === "diameter" ? "Jurin's law" : "the slot formula"} nor its correction holds, so no rise is given.`, fields, {
		step: "size-ratio",
		withholds: ["rise", "riseCorrected"]
	}));
	else if (ratio > geometry.notSmallRatio) warnings.push(warning(geometry.codes.notSmall, `Half the ${geometry.noun} is ${formatValue(ratio, 2)} of the capillary length (${q(lc, "m")}), so the liquid in the meniscus changes the rise by more than 2 %: use the corrected rise.`, fields, { step: "size-ratio" }));
	const near = nearNinety(angle.angleDeg);
	if (near !== null) warnings.push(tooWide ? near : {
		...near,
		step: "rise"
	});
	if (!tooWide && angle.angleDeg > 90) warnings.push(warning("MENISCUS_CORRECTION_NOT_APPLIED", "The meniscus is convex (θ > 90°); the meniscus-weight correction is for a concave meniscus and is not applied: the corrected rise is not defined here.", ANGLE_FIELDS, {
		step: "rise",
		withholds: ["riseCorrected"]
	}));
	return solved({
		outputs,
		working,
		warnings,
		band: bandOver(angle.basis, outputs, (v) => evaluate(v.contactAngleDeg ?? angle.angleDeg)),
		assumptions: [
			...STATIC_ASSUMPTIONS,
			geometry.shape,
			"The rise is measured from the flat free surface of a wide reservoir to the bottom of the meniscus.",
			liquid.assumption,
			angle.assumption,
			gravityAssumption(g)
		]
	}, liquid);
}
/**
* The headline of a rise: the corrected rise when the bore or gap is wide enough for the meniscus
* to matter (its warning asks for it), else the rise; pushed down when it is negative.
* @param where how the size reads in the sentence, `{input.diameter}` or `{input.gap}` in it
*/
function riseHeadline(geometry, where) {
	const say = (output, warning) => ({
		output,
		...warning !== void 0 ? { warning } : {},
		text: `{liquid} can climb about {value} ${where}.`,
		atOrBelow: `{liquid} is pushed down about {value} ${where}.`
	});
	return {
		rules: [say("riseCorrected", geometry.codes.notSmall), say("rise")],
		missing: "rise"
	};
}
/** The warning catalogue of a rise calculator. */
function riseWarnings(geometry) {
	return [
		{
			code: geometry.codes.notSmall,
			summary: `Half the ${geometry.noun} exceeds ${formatValue(geometry.notSmallRatio)} of the capillary length, where the meniscus weight changes the rise by more than 2 % (common practice threshold, ours).`
		},
		{
			code: geometry.codes.tooWide,
			summary: `Half the ${geometry.noun} is at least the capillary length: the capillary formulas do not hold.`
		},
		CONTACT_ANGLE_NEAR_90,
		{
			code: "MENISCUS_CORRECTION_NOT_APPLIED",
			summary: "A convex meniscus (θ > 90°): the meniscus-weight correction is not applied."
		}
	];
}
// packages/calc-core/dist/calculators/slot-rise.js
var calculator$5 = {
	id: "slot-rise",
	title: "Rise in a slot or crack",
	summary: "Height a liquid climbs between two parallel walls a small gap apart (a crack, a joint, a gap behind a lining), with the meniscus-weight correction.",
	inputs: riseInputs(quantityInput("length", "gap", "Gap between the walls", 5e-4, [1e-6, .05], { display: MM })),
	outputs: riseOutputs(SLOT, "Rise", "Half the gap / capillary length"),
	warnings: riseWarnings(SLOT),
	headline: riseHeadline(SLOT, "between walls {input.gap} apart"),
	solve: (inputs) => solveRise(SLOT, inputs)
};
// packages/calc-core/dist/calculators/slot-rise.texts.js
var texts$5 = {
	cautions: [
		ESTIMATE_CAUTION,
		{
			code: "REAL_CRACKS",
			text: "Real cracks taper, branch and are rough; the parallel-wall result is an upper-bound style estimate for the narrowest sustained width, not a measurement."
		},
		CLEAN_SURFACES_CAUTION,
		DAMP_CAUTION
	],
	references: [
		{
			id: "jurin-slot",
			citation: "Force balance of Jurin's law per unit length of two parallel plates, as in standard capillarity texts",
			usedFor: "h = 2σ cos θ/(ρ g w)",
			basis: "common practice"
		},
		RAYLEIGH_REFERENCE,
		...WATER_REFERENCES,
		...LIQUID_TABLE_REFERENCES
	]
};
// packages/calc-core/dist/calculators/soil-capillary-rise.js
/** IRC R506.2.2: a 4-inch-thick (102 mm) base course under a slab below grade. */
var CODE_MIN_LAYER_M = .1016;
/** ASTM E11 opening of the No. 4 sieve; ≤ 10 % passing it means D10 ≥ 4.75 mm. */
var NO4_SIEVE_M = .00475;
/** No. 200 sieve, the sand/fines boundary of ASTM D2487. */
var NO200_SIEVE_M = 75e-6;
var withLayer = [{
	input: "breakLayer",
	values: ["granular"]
}];
function solve$3(inputs) {
	const d10 = num(inputs, "d10");
	const e = num(inputs, "voidRatio");
	const c = num(inputs, "hazenC");
	const depth = num(inputs, "waterTableDepth");
	const layered = choice(inputs, "breakLayer") === "granular";
	const t = layered ? num(inputs, "layerThickness") : 0;
	const layerD10 = layered ? num(inputs, "layerD10") : 0;
	const layerE = layered ? num(inputs, "layerVoidRatio") : 0;
	const fine = d10 < NO200_SIEVE_M;
	const evaluate = (cValue) => {
		const soilRise = hazenCapillaryRise({
			d10,
			voidRatio: e,
			c: cValue
		});
		const layerRise = layered ? hazenCapillaryRise({
			d10: layerD10,
			voidRatio: layerE,
			c: cValue
		}) : null;
		const check = capillaryBreakCheck({
			waterTableDepth: depth,
			soilRise,
			...layerRise !== null ? { layer: {
				thickness: t,
				rise: layerRise
			} } : {}
		});
		return {
			capillaryRise: fine ? null : soilRise,
			layerCapillaryRise: layerRise,
			slabClearance: fine ? null : check.clearance
		};
	};
	const outputs = evaluate(c);
	const soilRise = hazenCapillaryRise({
		d10,
		voidRatio: e,
		c
	});
	const layerRise = layered ? hazenCapillaryRise({
		d10: layerD10,
		voidRatio: layerE,
		c
	}) : null;
	const check = capillaryBreakCheck({
		waterTableDepth: depth,
		soilRise,
		...layerRise !== null ? { layer: {
			thickness: t,
			rise: layerRise
		} } : {}
	});
	const clearance = check.clearance;
	const working = [];
	if (!fine) working.push(hazenRiseStep("soil-rise", "Capillary rise in the soil", c, e, d10, soilRise));
	const fringe = "equilibrium suction ρ·g·z: each material holds water up to its own capillary height (common practice)";
	if (layerRise !== null) working.push(hazenRiseStep("layer-rise", "Capillary rise in the granular layer", c, layerE, layerD10, layerRise));
	if (!fine && layerRise !== null) {
		const base = Math.max(depth - t, 0);
		working.push({
			id: "layer-base",
			label: "Height of the base of the layer above the water table",
			formula: "z_b = max(D_w − t, 0)",
			substituted: `max(${q(depth, "m")} − ${q(t, "m")}, 0)`,
			value: base,
			unit: "m",
			source: "geometry of the profile"
		}, {
			id: "wet-top",
			label: check.soilReachesLayer ? "Top of the wet zone: the soil fringe reaches the layer, which takes it to its own height" : "Top of the wet zone: the soil fringe stops below the layer, which stays dry",
			formula: "z_w = h_soil if h_soil < z_b, else max(z_b, h_layer)",
			substituted: check.soilReachesLayer ? `${q(soilRise, "m")} ≥ ${q(base, "m")}: max(${q(base, "m")}, ${q(layerRise, "m")})` : `${q(soilRise, "m")} < ${q(base, "m")}`,
			value: check.wetZoneTop,
			unit: "m",
			source: fringe
		}, {
			id: "clearance",
			label: "Clearance between the capillary zone and the slab",
			formula: "D_w − z_w",
			substituted: `${q(depth, "m")} − ${q(check.wetZoneTop, "m")}`,
			value: clearance,
			unit: "m",
			source: fringe
		});
	} else if (!fine) working.push({
		id: "clearance",
		label: "Clearance between the capillary zone and the slab",
		formula: "D_w − h_soil",
		substituted: `${q(depth, "m")} − ${q(soilRise, "m")}`,
		value: clearance,
		unit: "m",
		source: fringe
	});
	const band = bandOver([HAZEN_BASIS], outputs, (v) => evaluate(v.hazenC ?? c));
	if (band !== null) {
		const lo = evaluate(HAZEN_C_RANGE_M2.min);
		const hi = evaluate(HAZEN_C_RANGE_M2.max);
		const corner = (o) => Object.entries(o).filter(([, v]) => v !== null).map(([k, v]) => `${k} ${q(v ?? 0, "m")}`).join(", ");
		working.push({
			id: "band",
			label: "Band over the published range of Hazen's constant: the lowest clearance",
			formula: "the same steps at C = 0.1 cm² and C = 0.5 cm²",
			substituted: `C = 0.1 cm²: ${corner(lo)}; C = 0.5 cm²: ${corner(hi)}`,
			value: band.outputs.slabClearance?.low ?? band.outputs.layerCapillaryRise?.high ?? 0,
			unit: "m",
			source: HAZEN_SOURCE
		});
	}
	const worst = band?.outputs.slabClearance?.low ?? clearance;
	const warnings = [];
	if (!fine && clearance <= 0) warnings.push(warning("CAPILLARY_RISE_REACHES_SLAB", layered ? `The granular layer itself draws capillary water up to the slab (its rise of ${q(layerRise ?? 0, "m")} against a water table ${q(depth, "m")} below the slab): it does not work as a capillary break.` : `Capillary rise from the water table (${q(soilRise, "m")}) reaches the underside of the slab ${q(depth, "m")} above it.`, ["waterTableDepth"], { step: "clearance" }));
	else if (!fine && worst <= 0) warnings.push(warning("CAPILLARY_RISE_MAY_REACH_SLAB", `With Hazen's constant at the top of its published range (0.5 cm²) the capillary zone reaches the slab; the margin of ${q(clearance, "m")} is not secure.`, ["waterTableDepth", "hazenC"], { step: "band" }));
	if (layered && t < CODE_MIN_LAYER_M) warnings.push(warning("LAYER_THINNER_THAN_CODE_MINIMUM", `The granular layer is ${q(t, "m")} thick; IRC R506.2.2 asks for at least 4 in (102 mm) of base course under a slab below grade. Local codes govern.`, ["layerThickness"]));
	if (layered && layerD10 < NO4_SIEVE_M) warnings.push(warning("LAYER_NOT_CLEAN_GRAVEL", `A layer D10 of ${q(layerD10, "m")} means more than 10 % passes the No. 4 (4.75 mm) sieve; the IBC floor base course asks for gravel or crushed stone with no more than 10 % passing it.`, ["layerD10"], { step: "layer-rise" }));
	if (layered && depth <= t) warnings.push(warning("WATER_TABLE_IN_LAYER", "The water table is within the granular layer: the layer is saturated from below and cannot act as a capillary break.", ["waterTableDepth", "layerThickness"]));
	if (fine) warnings.push(warning("FINE_GRAINED_SOIL", `D10 of ${q(d10, "m")} is finer than the No. 200 sieve (0.075 mm): Hazen's relation was drawn from sands and does not hold in silts and clays, so no rise or clearance is given. Have the capillary rise measured, or use a soil-water retention curve.`, ["d10"], { withholds: ["capillaryRise", "slabClearance"] }));
	return solved({
		outputs,
		working,
		warnings,
		band,
		assumptions: [
			"Hydrostatic equilibrium above a static water table: no evaporation, infiltration or flow.",
			"Each material is uniform; its capillary height is Hazen's empirical estimate, a sharp top to the capillary fringe.",
			"Hazen's constant C within its published range of 0.1–0.5 cm² (the band spans all of it).",
			"Clean water at ordinary ground temperature.",
			...layered ? ["The granular layer lies directly under the slab, over the soil, with no membrane between."] : []
		]
	});
}
var calculator$4 = {
	id: "soil-capillary-rise",
	title: "Capillary rise in soil and capillary-break check",
	summary: "Height capillary water rises above the water table in a soil, by Hazen's formula with the band its published constant gives, and whether it reaches the underside of a slab or pavement through a granular capillary-break layer.",
	inputs: [
		quantityInput("length", "d10", "Effective grain size D10 of the soil", 1e-4, [1e-6, .02], {
			help: "The sieve size that 10 % of the soil by mass passes.",
			display: MM
		}),
		quantityInput("dimensionless", "voidRatio", "Void ratio e of the soil", .6, [.1, 3]),
		hazenCInput("Depends on grain shape and surface impurities; published range 0.1–0.5 cm². The default is the middle of the range; the band always spans all of it."),
		quantityInput("length", "waterTableDepth", "Depth of the water table below the underside of the slab", 1, [0, 50], { display: {
			si: "m",
			us: "ft"
		} }),
		{
			id: "breakLayer",
			label: "Under the slab",
			kind: "choice",
			default: "granular",
			options: [{
				value: "granular",
				label: "A granular capillary-break layer"
			}, {
				value: "none",
				label: "Slab directly on the soil"
			}]
		},
		quantityInput("length", "layerThickness", "Thickness of the granular layer", .15, [.01, 3], {
			appliesWhen: withLayer,
			display: MM
		}),
		quantityInput("length", "layerD10", "Effective grain size D10 of the layer", .006, [1e-4, .1], {
			appliesWhen: withLayer,
			display: MM
		}),
		quantityInput("dimensionless", "layerVoidRatio", "Void ratio of the layer", .5, [.1, 3], { appliesWhen: withLayer })
	],
	outputs: [
		{
			id: "capillaryRise",
			label: "Capillary rise in the soil",
			kind: "length",
			display: {
				si: "m",
				us: "ft"
			}
		},
		{
			id: "layerCapillaryRise",
			label: "Capillary rise in the granular layer",
			kind: "length",
			help: "Measured from the water table; Hazen applied to gravel is an order-of-magnitude figure.",
			display: {
				si: "mm",
				us: "in"
			}
		},
		{
			id: "slabClearance",
			label: "Clearance between the capillary zone and the slab",
			kind: "length",
			helpBySign: {
				above: "How far below the underside of the slab the capillary water stops.",
				atOrBelow: "Zero or less: capillary water reaches the underside of the slab."
			},
			display: {
				si: "m",
				us: "ft"
			}
		}
	],
	headline: {
		rules: [{
			output: "slabClearance",
			text: "Capillary water stays about {value} below the slab.",
			atOrBelow: "Capillary water reaches the slab."
		}],
		missing: "clearance under the slab"
	},
	warnings: [
		{
			code: "CAPILLARY_RISE_REACHES_SLAB",
			summary: "At the chosen C the capillary zone reaches the underside of the slab."
		},
		{
			code: "CAPILLARY_RISE_MAY_REACH_SLAB",
			summary: "The capillary zone stops below the slab at the chosen C but reaches it at the top of Hazen's published range."
		},
		{
			code: "LAYER_THINNER_THAN_CODE_MINIMUM",
			summary: "The granular layer is thinner than the 4 in (102 mm) of IRC R506.2.2."
		},
		{
			code: "LAYER_NOT_CLEAN_GRAVEL",
			summary: "More than 10 % of the layer passes the No. 4 sieve (D10 below 4.75 mm)."
		},
		{
			code: "WATER_TABLE_IN_LAYER",
			summary: "The water table is inside the granular layer."
		},
		{
			code: "FINE_GRAINED_SOIL",
			summary: "D10 is finer than 0.075 mm, outside the sands Hazen's relation was drawn from."
		}
	],
	solve: solve$3
};
// packages/calc-core/dist/calculators/soil-capillary-rise.texts.js
var texts$4 = {
	cautions: [
		ESTIMATE_CAUTION,
		FROST_CAUTION,
		FOUNDATIONS_CAUTION,
		{
			code: "DAMP_SLABS",
			text: "A capillary break does not stop vapour: moisture-sensitive floor finishes also need a vapour retarder and a dry slab, checked by measurement."
		},
		{
			code: "LOCAL_CODES",
			text: "The code checks quoted (IRC R506.2.2, the IBC floor base course) are US model-code provisions; the code that applies at the site governs the layer."
		}
	],
	references: [
		{
			id: "terzaghi-peck-1948",
			citation: "Terzaghi K., Peck R. B. (1948) Soil Mechanics in Engineering Practice, Wiley",
			usedFor: "Hazen's formula h_c = C/(e·D10) and the range of C, 0.1–0.5 cm² (as given by Smith, Elements of Soil Mechanics, and Holtz & Kovacs; recalled, not seen printed here)",
			basis: "from memory"
		},
		{
			id: "heath-1982",
			citation: "Heath R. C. (1982, rev. 1983) Basic Ground-Water Hydrology, USGS Water-Supply Paper 2220",
			usedFor: "typical capillary rise: coarse sand 12.5 cm, medium sand 25 cm, fine sand 40 cm, silt 100 cm",
			basis: "printed"
		},
		{
			id: "irc-r506-2-2",
			citation: "International Residential Code, R506.2.2 Base",
			usedFor: "4 in (102 mm) base course under a slab below grade",
			basis: "printed"
		},
		{
			id: "ibc-floor-base-course",
			citation: "International Building Code, floor base course (section 1807.4.1 in early editions)",
			usedFor: "at least 4 in of gravel or crushed stone with no more than 10 % passing the No. 4 sieve",
			basis: "printed"
		}
	]
};
// packages/calc-core/dist/calculators/tension-from-rise.js
/**
* r/ℓc above which Rayleigh's r/3 is more than 2 % of the rise (r²/(6ℓc²) = 0.02), the tube-rise
* calculator's threshold too; written here so this calculator's bundle does not carry the rise module.
*/
var NOT_SMALL_RATIO = Math.sqrt(.12);
var forTension = [{
	input: "solveFor",
	values: ["surfaceTension"]
}];
var forAngle = [{
	input: "solveFor",
	values: ["contactAngle"]
}];
var RAYLEIGH = "Rayleigh 1915, first order: r/3 of liquid held in the meniscus above its lowest point";
/** The rise to the bottom of the meniscus a contact angle gives: Jurin's rise less the meniscus correction, m. */
function riseFor(sigma, angleDeg, rho, g, d) {
	return 4 * sigma * Math.cos(angleDeg * Math.PI / 180) / (rho * g * d) - meniscusCorrection({
		diameter: d,
		contactAngleDeg: angleDeg
	});
}
/**
* The contact angle, 0–90°, whose corrected rise is `h`, by bisection on a rise that falls as the
* angle grows (null when `h` is above the fully wetting rise). 60 halvings put it within 1e-16 of 90°.
*/
function angleForRise(h, sigma, rho, g, d) {
	if (h > riseFor(sigma, 0, rho, g, d)) return null;
	let lo = 0;
	let hi = 90;
	for (let i = 0; i < 60; i++) {
		const mid = (lo + hi) / 2;
		if (riseFor(sigma, mid, rho, g, d) > h) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}
function solve$2(inputs) {
	const mode = choice(inputs, "solveFor");
	const h = num(inputs, "rise");
	const d = num(inputs, "diameter");
	const rho = num(inputs, "density");
	const g = num(inputs, "gravity");
	const r = d / 2;
	const working = [];
	const warnings = [];
	let sigma;
	let sigmaOut = null;
	let angleOut = null;
	let angleIn = 0;
	if (mode === "surfaceTension") {
		angleIn = num(inputs, "contactAngleDeg");
		const m = meniscusCorrection({
			diameter: d,
			contactAngleDeg: angleIn
		});
		sigma = rho * g * r * (h + m) / (2 * Math.cos(angleIn * Math.PI / 180));
		sigmaOut = sigma;
		working.push({
			id: "meniscus",
			label: "Meniscus-weight correction",
			formula: "δ = V_held / (π·r²); δ = r/3 at θ = 0",
			substituted: `r = ${q(r, "m")}, θ = ${q(angleIn, "deg")}`,
			value: m,
			unit: "m",
			source: "Rayleigh 1915 (r/3 at θ = 0); the same spherical-cap geometry for θ > 0, derived here"
		}, {
			id: "solved",
			label: "Surface tension",
			formula: "σ = ρ·g·r·(h + δ) / (2·cos θ)",
			substituted: `${q(rho, "kg/m3")} × ${q(g, "m/s2")} × ${q(r, "m")} × (${q(h, "m")} + ${q(m, "m")}) / (2 × cos ${q(angleIn, "deg")})`,
			value: sigma,
			unit: "N/m",
			source: RAYLEIGH
		});
		if (angleIn > 0) warnings.push(warning("CONTACT_ANGLE_NOT_ZERO", `A contact angle of ${q(angleIn, "deg")} is assumed: the method is run with a liquid that wets the clean tube fully (θ = 0); any other angle must be known independently, and its error goes straight into σ through cos θ.`, ["contactAngleDeg"], { step: "solved" }));
		const near = nearNinety(angleIn, ["contactAngleDeg"]);
		if (near !== null) warnings.push({
			...near,
			step: "solved"
		});
	} else {
		sigma = num(inputs, "surfaceTension");
		const wetting = riseFor(sigma, 0, rho, g, d);
		working.push({
			id: "wetting-rise",
			label: "Rise of a fully wetting liquid (θ = 0) in this bore",
			formula: "h₀ = 4·σ / (ρ·g·d) − r/3",
			substituted: `4 × ${q(sigma, "N/m")} / (${q(rho, "kg/m3")} × ${q(g, "m/s2")} × ${q(d, "m")}) − ${q(r, "m")}/3`,
			value: wetting,
			unit: "m",
			source: RAYLEIGH
		});
		const angle = angleForRise(h, sigma, rho, g, d);
		if (angle === null) warnings.push(warning("NO_ANGLE_FOR_RISE", `No contact angle gives this rise: ${q(h * 1e3, "mm")} is above the ${q(wetting * 1e3, "mm")} that a fully wetting liquid reaches in this bore. The surface tension entered is too low, the bore is narrower than stated, or the rise was read to the top of the meniscus instead of its bottom.`, [
			"rise",
			"surfaceTension",
			"diameter"
		], {
			step: "wetting-rise",
			withholds: ["contactAngleDeg"]
		}));
		else {
			angleOut = angle;
			working.push({
				id: "solved",
				label: "Contact angle",
				formula: "θ such that h = 4·σ·cos θ / (ρ·g·d) − δ(θ), solved by bisection over 0–90°",
				substituted: `h = ${q(h, "m")}: θ = ${q(angle, "deg")}, δ(θ) = ${q(meniscusCorrection({
					diameter: d,
					contactAngleDeg: angle
				}), "m")}`,
				value: angle,
				unit: "deg",
				source: "Jurin's law with Rayleigh's meniscus correction (its geometry for θ > 0 derived here)"
			});
			const poor = poorlyDetermined(angle, "rise", ["rise", "surfaceTension"], "solved");
			if (poor !== null) warnings.push(poor);
		}
	}
	const lc = Math.sqrt(sigma / (rho * g));
	const ratio = r / lc;
	working.push(capillaryLengthStep(sigma, rho, g, lc), {
		id: "size-ratio",
		label: "Bore radius against the capillary length",
		formula: "r / ℓc",
		substituted: `${q(r, "m")} / ${q(lc, "m")}`,
		value: ratio,
		unit: "1",
		source: "Rayleigh 1915 (the first-order correction needs r ≪ ℓc)"
	});
	const solvedId = mode === "surfaceTension" ? "surfaceTension" : "contactAngleDeg";
	if (ratio >= 1) {
		warnings.push(warning("BORE_TOO_WIDE", `The bore radius is ${formatValue(ratio)} times the capillary length (${q(lc * 1e3, "mm")}): the meniscus is flattened by gravity and Rayleigh's first-order form does not hold, so no ${mode === "surfaceTension" ? "surface tension" : "contact angle"} is given. Use a narrower tube (radius well under ${q(lc * 1e3, "mm")}).`, ["diameter"], {
			step: "size-ratio",
			withholds: [solvedId]
		}));
		if (mode === "surfaceTension") sigmaOut = null;
		else angleOut = null;
	} else if (ratio > NOT_SMALL_RATIO) warnings.push(warning("BORE_NOT_SMALL", `The bore radius is ${formatValue(ratio)} of the capillary length (${q(lc * 1e3, "mm")}): the meniscus term r/3 is more than 2 % of the rise and the higher terms of Rayleigh's series, left out here, start to count. A narrower tube gives a better figure.`, ["diameter"], { step: "size-ratio" }));
	return solved({
		outputs: {
			surfaceTension: sigmaOut,
			contactAngleDeg: angleOut,
			capillaryLength: lc,
			radiusToCapillaryLength: ratio
		},
		working,
		warnings,
		band: null,
		assumptions: [
			"Static equilibrium: the meniscus has stopped moving (read after it has risen and, better, after it has been let fall back to the same height).",
			"A clean, round, uniform, vertical bore dipping into a reservoir wide enough for its surface to be flat.",
			"The rise is measured from the flat reservoir surface to the bottom of the meniscus.",
			mode === "surfaceTension" ? `A contact angle of ${q(angleIn, "deg")} between the liquid and the tube, known independently.` : `A surface tension of ${q(sigma, "N/m")}, measured on the same liquid.`,
			"Air density neglected against the liquid density.",
			gravityAssumption(g)
		]
	});
}
var calculator$3 = {
	id: "tension-from-rise",
	title: "Surface tension or contact angle from a rise in a tube",
	summary: "The surface tension of a liquid from the height it rises in a narrow clean tube, or its contact angle on the tube when the surface tension is known, with Rayleigh's meniscus correction; withheld when the bore is not small against the capillary length.",
	inputs: [
		{
			id: "solveFor",
			label: "Find",
			kind: "choice",
			default: "surfaceTension",
			options: [{
				value: "surfaceTension",
				label: "Surface tension (contact angle known)"
			}, {
				value: "contactAngle",
				label: "Contact angle (surface tension known)"
			}]
		},
		quantityInput("length", "rise", "Measured rise to the bottom of the meniscus", .025, [1e-5, 1], { display: MM }),
		quantityInput("length", "diameter", "Bore (inside diameter)", .001, [1e-6, .05], { display: MM }),
		quantityInput("density", "density", "Liquid density", 998.2, [100, 25e3]),
		quantityInput("angle", "contactAngleDeg", "Contact angle on the tube", 0, [0, 89], {
			help: "Clean glass and water: 0° (common practice).",
			appliesWhen: forTension
		}),
		quantityInput("surfaceTension", "surfaceTension", "Surface tension of the liquid", .0728, [.001, 1], { appliesWhen: forAngle }),
		gravityInput()
	],
	outputs: [
		{
			id: "surfaceTension",
			label: "Surface tension",
			kind: "surfaceTension"
		},
		{
			id: "contactAngleDeg",
			label: "Contact angle",
			kind: "angle"
		},
		{
			id: "capillaryLength",
			label: "Capillary length",
			kind: "length",
			display: MM
		},
		{
			id: "radiusToCapillaryLength",
			label: "Bore radius / capillary length",
			kind: "dimensionless"
		}
	],
	headline: {
		rules: [{
			when: [{
				input: "solveFor",
				values: ["surfaceTension"]
			}],
			output: "surfaceTension",
			text: "The rise gives a surface tension of about {value}."
		}, {
			when: [{
				input: "solveFor",
				values: ["contactAngle"]
			}],
			output: "contactAngleDeg",
			text: "The rise gives a contact angle of about {value} on the tube wall."
		}],
		missing: "figure from this rise"
	},
	warnings: [
		{
			code: "BORE_TOO_WIDE",
			summary: "The bore radius is at least the capillary length: no surface tension or angle is given."
		},
		{
			code: "BORE_NOT_SMALL",
			summary: `The bore radius exceeds ${formatValue(NOT_SMALL_RATIO)} of the capillary length, where the meniscus term is over 2 % of the rise.`
		},
		{
			code: "NO_ANGLE_FOR_RISE",
			summary: "cos θ from the rise is above 1: no contact angle gives this rise."
		},
		{
			code: "CONTACT_ANGLE_NOT_ZERO",
			summary: "A non-zero contact angle is assumed when reading the surface tension."
		},
		CONTACT_ANGLE_NEAR_90,
		ANGLE_POORLY_DETERMINED
	],
	solve: solve$2
};
// packages/calc-core/dist/calculators/tension-from-rise.texts.js
var texts$3 = {
	cautions: [
		ESTIMATE_CAUTION,
		OTHER_LIQUID_CAUTION,
		{
			code: "TUBE_CLEANING",
			text: "The tube must be scrupulously clean and wetted before the reading; grease or detergent residue changes the contact angle and the result more than any correction."
		},
		CLEAN_SURFACES_CAUTION
	],
	references: [
		{
			id: "rayleigh-1915",
			citation: "Lord Rayleigh (1915) On the theory of the capillary tube, Proc. R. Soc. Lond. A 92, 184–195",
			usedFor: "surface tension from a rise in a narrow tube with the meniscus correction r/3, valid for r ≪ ℓc (the same geometry for θ > 0 derived here)",
			basis: "printed"
		},
		{
			id: "jurin-1718",
			citation: "Jurin J. (1718) An account of some experiments shown before the Royal Society, Phil. Trans. 30, 739–747",
			usedFor: "the force balance of a rise in a tube",
			basis: "printed"
		},
		{
			id: "de-gennes-2004",
			citation: "de Gennes P.-G., Brochard-Wyart F., Quéré D. (2004) Capillarity and Wetting Phenomena, Springer",
			usedFor: "the capillary length ℓc = √(σ/(ρ·g))",
			basis: "printed"
		}
	]
};
// packages/calc-core/dist/calculators/tube-rise.js
var calculator$2 = {
	id: "tube-rise",
	title: "Capillary rise or depression in a tube",
	summary: "Height a liquid climbs (or is pushed down) in a narrow round tube, by Jurin's law, with the liquid's properties at its temperature and the meniscus-weight correction.",
	inputs: riseInputs(quantityInput("length", "diameter", "Bore (inside diameter)", .001, [1e-6, .05], { display: MM })),
	outputs: riseOutputs(TUBE, "Rise (Jurin's law)", "Bore radius / capillary length"),
	warnings: riseWarnings(TUBE),
	headline: riseHeadline(TUBE, "in a {input.diameter} bore"),
	solve: (inputs) => solveRise(TUBE, inputs)
};
// packages/calc-core/dist/calculators/tube-rise.texts.js
var texts$2 = {
	cautions: [
		ESTIMATE_CAUTION,
		CLEAN_SURFACES_CAUTION,
		DAMP_CAUTION
	],
	references: [
		{
			id: "jurin-1718",
			citation: "Jurin J. (1718) An account of some experiments shown before the Royal Society, Phil. Trans. 30, 739–747",
			usedFor: "Jurin's law, h = 4σ cos θ/(ρ g d)",
			basis: "printed"
		},
		RAYLEIGH_REFERENCE,
		...WATER_REFERENCES,
		...LIQUID_TABLE_REFERENCES
	]
};
// packages/calc-core/dist/calculators/wetting-force.js
var forward = [{
	input: "method",
	values: ["plate-force", "rod-force"]
}];
var plateInverse = [{
	input: "method",
	values: ["plate-tension"]
}];
var rodInverse = [{
	input: "method",
	values: ["rod-tension"]
}];
var plateOrRod = [{
	input: "method",
	values: [
		"plate-force",
		"plate-tension",
		"rod-force",
		"rod-tension"
	]
}];
var plate = [{
	input: "method",
	values: ["plate-force", "plate-tension"]
}];
var rod = [{
	input: "method",
	values: ["rod-force", "rod-tension"]
}];
var ring = [{
	input: "method",
	values: ["ring"]
}];
/** ASTM D971: the ring's circumference is at least 40 mm. */
var ASTM_MIN_RING_CIRCUMFERENCE_M = .04;
var PLATE_FIELDS = {
	width: "plateWidth",
	thickness: "plateThickness"
};
var ROD_FIELDS = { diameter: "rodDiameter" };
function solve$1(inputs) {
	const method = choice(inputs, "method");
	const working = [];
	const warnings = [];
	let liquidAssumption = null;
	let force = null;
	let sigma = null;
	let apparent = null;
	let factor = null;
	let perimeter;
	let assumptions;
	let hazards = [];
	if (method === "ring") {
		const F = num(inputs, "ringForce");
		const R = num(inputs, "ringRadius");
		const r = num(inputs, "wireRadius");
		const drho = num(inputs, "densityDifference");
		const g = num(inputs, "gravity");
		const x = withFieldNames({ force: "ringForce" }, () => ringCorrection({
			force: F,
			ringRadius: R,
			wireRadius: r,
			densityDifference: drho,
			gravity: g
		}));
		perimeter = 4 * Math.PI * R;
		apparent = x.apparent;
		const t = RING_TABLE_RANGE;
		const { base, k, c, m } = ZUIDEMA_WATERS;
		const applies = x.inTableRange && x.factor !== null;
		factor = applies ? x.factor : null;
		sigma = applies && x.factor !== null ? x.factor * x.apparent : null;
		working.push({
			id: "apparent",
			label: "Apparent surface tension (uncorrected)",
			formula: "σ* = F / (4π·R)",
			substituted: `${q(F, "N")} / (4π × ${q(R, "m")})`,
			value: x.apparent,
			unit: "N/m",
			source: "du Noüy 1925"
		}, {
			id: "ring-ratio",
			label: "Ring to wire radius",
			formula: "R / r",
			substituted: `${q(R, "m")} / ${q(r, "m")}`,
			value: x.ringToWire,
			unit: "1",
			source: `Harkins & Jordan 1930: tables span R/r ${t.ringToWire.min}–${t.ringToWire.max} (from memory)`
		}, {
			id: "lifted-volume",
			label: "Volume of liquid lifted",
			formula: "V = F / (Δρ·g)",
			substituted: `${q(F, "N")} / (${q(drho, "kg/m3")} × ${q(g, "m/s2")})`,
			value: x.liftedVolume,
			unit: "m3",
			source: "Harkins & Jordan 1930"
		}, {
			id: "ring-range",
			label: "Ring size against the lifted volume",
			formula: "R³ / V",
			substituted: `(${q(R, "m")})³ / ${q(x.liftedVolume, "m3")}`,
			value: x.r3OverV,
			unit: "1",
			source: `Harkins & Jordan 1930: tables span R³/V ${t.r3OverV.min}–${t.r3OverV.max} (from memory)`
		}, {
			id: "ring-radicand",
			label: "Zuidema–Waters radicand",
			formula: `k·P·(gₙ/g) / (C²·(D − d)) + c − m·r/R; k = ${coef(k)}, c = ${coef(c)}, m = ${coef(m)}; P in dyn/cm, C in cm, D − d in g/mL`,
			substituted: `P = ${formatValue(x.apparent * 1e3)} dyn/cm, C = ${formatValue(2 * Math.PI * R * 100)} cm, D − d = ${formatValue(drho / 1e3)} g/mL, gₙ/g = ${formatValue(STANDARD_GRAVITY / g, 6)}, r/R = ${formatValue(r / R)}`,
			value: x.radicand,
			unit: "1",
			source: "Zuidema & Waters 1941 in the form of ASTM D971 (from memory)"
		});
		if (applies && x.root !== null && x.factor !== null) working.push({
			id: "ring-factor",
			label: "Zuidema–Waters correction factor",
			formula: `f = ${coef(base)} + √radicand`,
			substituted: `${coef(base)} + √${formatValue(x.radicand)} = ${coef(base)} + ${formatValue(x.root)}`,
			value: x.factor,
			unit: "1",
			source: "Zuidema & Waters 1941 in the form of ASTM D971 (from memory)"
		}, {
			id: "ring-corrected",
			label: "Surface tension, corrected",
			formula: "σ = f·σ*",
			substituted: `${formatValue(x.factor)} × ${q(x.apparent, "N/m")}`,
			value: x.factor * x.apparent,
			unit: "N/m",
			source: "Harkins & Jordan 1930"
		});
		if (!applies) {
			const why = [];
			if (x.ringToWire < t.ringToWire.min || x.ringToWire > t.ringToWire.max) why.push(`R/r = ${formatValue(x.ringToWire)} is outside ${t.ringToWire.min}–${t.ringToWire.max}`);
			if (x.r3OverV < t.r3OverV.min || x.r3OverV > t.r3OverV.max) why.push(`R³/V = ${formatValue(x.r3OverV)} is outside ${t.r3OverV.min}–${t.r3OverV.max}`);
			if (x.factor === null) why.push(`the radicand is negative (${formatValue(x.radicand)})`);
			warnings.push(warning("RING_OUTSIDE_CORRECTION_RANGE", `The ring correction does not hold here: ${why.join("; ")}. The Zuidema–Waters fit reproduces the Harkins & Jordan tables only over their range (from memory), so no corrected value is given; the uncorrected F/(4πR) stands alone.`, [
				"ringRadius",
				"wireRadius",
				"ringForce",
				"densityDifference"
			], {
				step: x.factor === null ? "ring-radicand" : "ring-range",
				withholds: ["surfaceTension", "correctionFactor"]
			}));
		} else if (x.factor !== null && (x.factor < t.factor.min || x.factor > t.factor.max)) warnings.push(warning("RING_FACTOR_OUTSIDE_TABLES", `A factor of ${formatValue(x.factor)} is outside the ${t.factor.min}–${t.factor.max} that the Harkins & Jordan tables give (from memory): check the ring dimensions and the density difference.`, [
			"ringRadius",
			"wireRadius",
			"densityDifference"
		], { step: "ring-factor" }));
		if (drho < 100) warnings.push(warning("DENSITY_DIFFERENCE_IMPLAUSIBLE", `A density difference of ${q(drho, "kg/m3")} (${formatValue(drho / 1e3)} g/mL) is below 100 kg/m³. Against air it is the liquid's own density (about 1000 kg/m³ for water): a value in g/mL typed as kg/m³ gives this. Only two liquids of near-equal density come this close.`, ["densityDifference"], { step: "lifted-volume" }));
		if (2 * Math.PI * R < ASTM_MIN_RING_CIRCUMFERENCE_M) warnings.push(warning("RING_BELOW_ASTM_SIZE", `The ring's circumference is ${q(2 * Math.PI * R, "m")}; ASTM D971 specifies at least 40 mm, and the Zuidema–Waters fit was made for such rings.`, ["ringRadius"], { step: "apparent" }));
		assumptions = [
			"The maximum pull, net of the weight of the ring, read as the ring is drawn slowly through the surface.",
			"The ring is horizontal, round and fully wetted by the liquid (contact angle 0° on clean platinum).",
			"Clean liquid and a fresh surface: no surfactant, oil or dust.",
			"Against air the density difference is the liquid density; air density neglected.",
			gravityAssumption(g)
		];
	} else {
		const theta = num(inputs, "contactAngleDeg");
		const isPlate = method === "plate-force" || method === "plate-tension";
		const w = isPlate ? num(inputs, "plateWidth") : 0;
		const t = isPlate ? num(inputs, "plateThickness") : 0;
		const d = isPlate ? 0 : num(inputs, "rodDiameter");
		perimeter = isPlate ? platePerimeter(w, t) : Math.PI * d;
		working.push({
			id: "perimeter",
			source: "geometry of the probe",
			label: "Wetted length",
			formula: isPlate ? "P = 2·(w + t)" : "P = π·d",
			substituted: isPlate ? `2 × (${q(w, "m")} + ${q(t, "m")})` : `π × ${q(d, "m")}`,
			value: perimeter,
			unit: "m"
		});
		if (method === "plate-force" || method === "rod-force") {
			const liquid = resolveLiquid(inputs, {});
			working.unshift(...liquid.working);
			if (liquid.hazard !== void 0) hazards = [liquid.hazard];
			liquidAssumption = liquid.assumption;
			const s = liquid.surfaceTension;
			force = isPlate ? wilhelmyForce({
				surfaceTension: s,
				contactAngleDeg: theta,
				width: w,
				thickness: t
			}) : wilhelmyRodForce({
				surfaceTension: s,
				contactAngleDeg: theta,
				diameter: d
			});
			working.push({
				id: "method",
				source: "Wilhelmy 1863",
				label: "Wetting force",
				formula: "F = σ·P·cos θ",
				substituted: `${q(s, "N/m")} × ${q(perimeter, "m")} × cos ${q(theta, "deg")}`,
				value: force,
				unit: "N"
			});
		} else {
			const F = num(inputs, isPlate ? "force" : "rodForce");
			sigma = isPlate ? withFieldNames(PLATE_FIELDS, () => wilhelmySurfaceTension({
				force: F,
				contactAngleDeg: theta,
				width: w,
				thickness: t
			})) : withFieldNames({
				...ROD_FIELDS,
				force: "rodForce"
			}, () => wilhelmyRodSurfaceTension({
				force: F,
				contactAngleDeg: theta,
				diameter: d
			}));
			working.push({
				id: "method",
				source: "Wilhelmy 1863",
				label: "Surface tension",
				formula: "σ = F / (P·cos θ)",
				substituted: `${q(F, "N")} / (${q(perimeter, "m")} × cos ${q(theta, "deg")})`,
				value: sigma,
				unit: "N/m"
			});
			if (theta > 0) warnings.push(warning("CONTACT_ANGLE_NOT_ZERO", `A contact angle of ${q(theta, "deg")} is assumed. The plate method is normally run fully wetted (θ = 0, e.g. roughened platinum); any other angle must be known independently.`, ["contactAngleDeg"], { step: "method" }));
		}
		const near = nearNinety(theta, ["contactAngleDeg"]);
		if (near !== null) warnings.push({
			...near,
			step: "method"
		});
		assumptions = [
			"The force is read at zero immersion depth, net of the weight of the probe: buoyancy is not included.",
			`A contact angle of ${q(theta, "deg")} on the probe, known independently (0° for a clean roughened platinum plate, common practice).`,
			"Clean liquid and a fresh surface: no surfactant, oil or dust.",
			isPlate ? "A thin rectangular plate wetted along its whole perimeter 2·(w + t)." : "A round rod or fibre wetted around its circumference π·d.",
			...liquidAssumption !== null ? [liquidAssumption] : []
		];
	}
	return {
		outputs: {
			force,
			surfaceTension: sigma,
			apparentSurfaceTension: apparent,
			correctionFactor: factor,
			wettedLength: perimeter
		},
		working,
		warnings,
		band: null,
		assumptions,
		...hazards.length > 0 ? { hazards } : {}
	};
}
function forceInput(id, label, defaultN, when) {
	return quantityInput("force", id, label, defaultN, [1e-7, 1], {
		help: "Net of the probe weight, at zero immersion depth.",
		appliesWhen: when,
		display: {
			si: "mN",
			us: "mN"
		}
	});
}
function lengthInput(id, label, defaultM, range, when) {
	return quantityInput("length", id, label, defaultM, range, {
		appliesWhen: when,
		display: MM
	});
}
var calculator$1 = {
	id: "wetting-force",
	title: "Wetting force (tensiometry)",
	summary: "Wilhelmy plate and rod, from surface tension to force and back, and the du Noüy ring with the Zuidema–Waters correction of ASTM D971 beside the uncorrected value.",
	inputs: [
		{
			id: "method",
			label: "Method",
			kind: "choice",
			default: "plate-tension",
			options: [
				{
					value: "plate-tension",
					label: "Wilhelmy plate: surface tension from the force"
				},
				{
					value: "plate-force",
					label: "Wilhelmy plate: force from the surface tension"
				},
				{
					value: "rod-tension",
					label: "Rod or fibre: surface tension from the force"
				},
				{
					value: "rod-force",
					label: "Rod or fibre: force from the surface tension"
				},
				{
					value: "ring",
					label: "du Noüy ring (ASTM D971 correction)"
				}
			]
		},
		...liquidInputs({ when: forward }),
		forceInput("force", "Measured force on the plate", .0029, plateInverse),
		forceInput("rodForce", "Measured force on the rod", 23e-5, rodInverse),
		{
			id: "contactAngleDeg",
			label: "Contact angle on the probe",
			kind: "angle",
			default: 0,
			min: 0,
			max: 180,
			help: "A clean roughened platinum plate is taken as fully wetted, 0° (common practice).",
			appliesWhen: plateOrRod
		},
		lengthInput("plateWidth", "Plate width", .02, [1e-4, .2], plate),
		lengthInput("plateThickness", "Plate thickness", 1e-4, [0, .01], plate),
		lengthInput("rodDiameter", "Rod diameter", .001, [1e-5, .2], rod),
		forceInput("ringForce", "Maximum pull on the ring", .009, ring),
		{
			...lengthInput("ringRadius", "Mean ring radius R", .00955, [.001, .05], ring),
			help: "Half the mean diameter; ASTM D971 rings have a circumference of at least 40 mm."
		},
		lengthInput("wireRadius", "Wire radius r", 2e-4, [1e-5, .001], ring),
		quantityInput("density", "densityDifference", "Density difference of the two phases", 998, [1, 25e3], {
			help: "Lower phase minus upper; against air, the liquid density. ASTM D971 states it in g/mL.",
			appliesWhen: ring,
			display: {
				si: "g/mL",
				us: "g/mL"
			}
		}),
		gravityInput(ring)
	],
	outputs: [
		{
			id: "force",
			label: "Wetting force",
			kind: "force",
			display: {
				si: "mN",
				us: "mN"
			}
		},
		{
			id: "surfaceTension",
			label: "Surface tension",
			kind: "surfaceTension",
			help: "For the ring, the corrected value."
		},
		{
			id: "apparentSurfaceTension",
			label: "Uncorrected ring value F/(4πR)",
			kind: "surfaceTension"
		},
		{
			id: "correctionFactor",
			label: "Correction factor f",
			kind: "dimensionless"
		},
		{
			id: "wettedLength",
			label: "Wetted length",
			kind: "length",
			display: {
				si: "mm",
				us: "in"
			}
		}
	],
	headline: {
		rules: [
			{
				when: [{
					input: "method",
					values: ["plate-force"]
				}],
				output: "force",
				text: "The liquid pulls on the plate with about {value}."
			},
			{
				when: [{
					input: "method",
					values: ["rod-force"]
				}],
				output: "force",
				text: "The liquid pulls on the rod with about {value}."
			},
			{
				output: "surfaceTension",
				text: "The surface tension is about {value}."
			}
		],
		missing: "corrected surface tension"
	},
	warnings: [
		{
			code: "CONTACT_ANGLE_NOT_ZERO",
			summary: "A non-zero contact angle is assumed for a plate or rod reading."
		},
		CONTACT_ANGLE_NEAR_90,
		{
			code: "RING_BELOW_ASTM_SIZE",
			summary: "The ring is smaller than the 40 mm circumference of ASTM D971."
		},
		{
			code: "RING_OUTSIDE_CORRECTION_RANGE",
			summary: "R/r or R³/V is outside the range of the Harkins & Jordan tables (from memory: R/r 30–80, R³/V 0.3–4.5), or the radicand is negative: no corrected value is given."
		},
		{
			code: "RING_FACTOR_OUTSIDE_TABLES",
			summary: "The correction factor is outside the 0.75–1.05 band of the tables (from memory)."
		},
		{
			code: "DENSITY_DIFFERENCE_IMPLAUSIBLE",
			summary: "A density difference below 100 kg/m³: against air, likely a g/mL value typed as kg/m³."
		}
	],
	solve: solve$1
};
// packages/calc-core/dist/calculators/wetting-force.texts.js
var texts$1 = {
	cautions: [
		ESTIMATE_CAUTION,
		{
			code: "PROBE_CLEANING",
			text: "Plates and rings must be cleaned (e.g. flamed platinum) and the liquid surface fresh; a trace of contamination lowers the reading more than any correction changes it."
		},
		{
			code: "BUOYANCY_NEGLECTED",
			text: "The plate and rod forms take the force at zero immersion depth; any immersion adds a buoyancy term that is not included."
		},
		CLEAN_SURFACES_CAUTION
	],
	references: [
		{
			id: "wilhelmy-1863",
			citation: "Wilhelmy L. (1863) Ueber die Abhängigkeit der Capillaritäts-Constanten des Alkohols von Substanz und Gestalt des benetzten festen Körpers, Ann. Phys. 195, 177–217",
			usedFor: "F = σ·P·cos θ",
			basis: "printed"
		},
		{
			id: "astm-d971",
			citation: "ASTM D971, Standard Test Method for Interfacial Tension of Insulating Liquids Against Water by the Ring Method",
			usedFor: "the Zuidema–Waters factor as ASTM writes it (recalled, from memory; the current edition governs), ring of at least 40 mm circumference",
			basis: "from memory"
		},
		{
			id: "zuidema-waters-1941",
			citation: "Zuidema H. H., Waters G. W. (1941) Ring method for the determination of interfacial tension, Ind. Eng. Chem. Anal. Ed. 13, 312–313",
			usedFor: "the ring correction factor (the form of the fit recalled, not seen printed here)",
			basis: "from memory"
		},
		{
			id: "harkins-jordan-1930",
			citation: "Harkins W. D., Jordan H. F. (1930) A method for the determination of surface and interfacial tension from the maximum pull on a ring, J. Am. Chem. Soc. 52, 1751–1772",
			usedFor: "the variables R/r and R³/V and the range of the correction tables (range from memory)",
			basis: "from memory"
		},
		{
			id: "du-nouy-1925",
			citation: "du Noüy P. L. (1925) An interfacial tensiometer for universal use, J. Gen. Physiol. 7, 625–631",
			usedFor: "the ring method, σ* = F/(4πR)",
			basis: "printed"
		},
		...WATER_REFERENCES,
		...LIQUID_TABLE_REFERENCES
	]
};
// packages/calc-core/dist/calculators/wicking-time.js
/** Gravity-restrained time over Lucas–Washburn time above which gravity is called not negligible. */
var GRAVITY_RATIO_LIMIT = 1.05;
/**
* Bosanquet time over Lucas–Washburn time above which inertia is called not negligible (our
* threshold, the same 5 % as for gravity). Since t_B/t_LW − 1 ≈ 1/(b·t_LW) for long times, this is
* about t_LW < 20·ρr²/(8μ): the wicking time is less than twenty inertial time scales.
*/
var INERTIA_RATIO_LIMIT = 1.05;
var WASHBURN = "Lucas 1918; Washburn 1921";
var BOSANQUET = "Bosanquet 1923";
function solve(inputs) {
	const vertical = choice(inputs, "direction") === "vertical";
	const liquid = resolveLiquid(inputs, {
		density: true,
		viscosity: true
	});
	const angle = resolveContactAngle(inputs, liquid.id);
	const L = num(inputs, "length");
	const r = num(inputs, "poreRadius");
	const g = num(inputs, "gravity");
	const { surfaceTension: sigma, density: rho, viscosity: mu } = liquid;
	const compute = (theta) => {
		const args = {
			poreRadius: r,
			surfaceTension: sigma,
			contactAngleDeg: theta,
			viscosity: mu
		};
		const time = washburnTime({
			...args,
			length: L
		});
		const inertial = bosanquetTime({
			...args,
			length: L,
			density: rho
		});
		if (!vertical) return {
			time,
			inertial,
			limit: null,
			withGravity: null
		};
		const limit = jurinRise({
			surfaceTension: sigma,
			contactAngleDeg: theta,
			density: rho,
			diameter: 2 * r,
			gravity: g
		});
		return {
			time,
			inertial,
			limit,
			withGravity: L < limit ? gravityRestrainedRiseTime({
				...args,
				height: L,
				density: rho,
				gravity: g
			}) : null
		};
	};
	const lc = capillaryLength({
		surfaceTension: sigma,
		density: rho,
		gravity: g
	});
	const tooWide = r >= lc;
	const evaluate = (theta) => {
		if (tooWide) return {
			time: null,
			timeWithInertia: null,
			jurinLimit: null,
			timeWithGravity: null
		};
		const x = compute(theta);
		const inertiaMatters = x.inertial.time / x.time > INERTIA_RATIO_LIMIT;
		if (!vertical) return {
			time: inertiaMatters ? null : x.time,
			timeWithInertia: x.inertial.time,
			jurinLimit: null,
			timeWithGravity: null
		};
		const reached = x.withGravity !== null;
		return {
			time: reached && !inertiaMatters ? x.time : null,
			timeWithInertia: null,
			jurinLimit: x.limit,
			timeWithGravity: reached && !inertiaMatters ? x.withGravity : null
		};
	};
	const outputs = evaluate(angle.angleDeg);
	const working = [
		...liquid.working,
		...angle.working,
		capillaryLengthStep(sigma, rho, g, lc, "Capillary length (the pore must be well below it)")
	];
	const warnings = [];
	if (tooWide) {
		warnings.push(warning("PORE_TOO_WIDE", `A radius of ${q(r, "m")} is at least the capillary length (${q(lc, "m")}): the meniscus is flattened by gravity and the capillary pressure behind every time here does not hold, so none is given.`, ["poreRadius"], {
			step: "capillary-length",
			withholds: [
				"time",
				"timeWithInertia",
				"jurinLimit",
				"timeWithGravity"
			]
		}));
		return solved({
			outputs,
			working,
			warnings,
			band: null,
			assumptions: [
				"Laminar flow of a Newtonian liquid in a uniform cylindrical capillary of the effective radius given.",
				liquid.assumption,
				angle.assumption,
				gravityAssumption(g)
			]
		}, liquid);
	}
	const raw = compute(angle.angleDeg);
	const inertiaRatio = raw.inertial.time / raw.time;
	const inertiaMatters = inertiaRatio > INERTIA_RATIO_LIMIT;
	working.push({
		id: "washburn",
		label: "Time, Lucas–Washburn (gravity and inertia neglected)",
		formula: "t = 2·μ·L² / (σ·r·cos θ)",
		substituted: `2 × ${q(mu, "Pa*s")} × (${q(L, "m")})² / (${q(sigma, "N/m")} × ${q(r, "m")} × cos ${q(angle.angleDeg, "deg")})`,
		value: raw.time,
		unit: "s",
		source: WASHBURN
	}, {
		id: "inertia-scale",
		label: "Inertial time scale",
		formula: "1/b = ρ·r² / (8·μ)",
		substituted: `${q(rho, "kg/m3")} × (${q(r, "m")})² / (8 × ${q(mu, "Pa*s")})`,
		value: 1 / raw.inertial.b,
		unit: "s",
		source: BOSANQUET
	}, {
		id: "bosanquet",
		label: vertical ? "Time with inertia, horizontal (the size of the inertia effect)" : "Time with inertia, Bosanquet",
		formula: "L² = (a / b²)·(b·t − 1 + e^(−b·t)), a = 4·σ·cos θ / (ρ·r), b = 8·μ / (ρ·r²); solved for t",
		substituted: `a = ${formatValue(raw.inertial.a)} m²/s², b = ${formatValue(raw.inertial.b)} 1/s, b·t = ${formatValue(raw.inertial.tau)}; against Lucas–Washburn × ${formatValue(inertiaRatio)}`,
		value: raw.inertial.time,
		unit: "s",
		source: BOSANQUET
	});
	const withheldByInertia = vertical ? ["time", "timeWithGravity"] : ["time"];
	if (vertical && raw.limit !== null) {
		const limit = raw.limit;
		working.push({
			id: "jurin-limit",
			label: "Jurin limit of the rise",
			formula: "h_J = 2·σ·cos θ / (ρ·g·r)",
			substituted: `2 × ${q(sigma, "N/m")} × cos ${q(angle.angleDeg, "deg")} / (${q(rho, "kg/m3")} × ${q(g, "m/s2")} × ${q(r, "m")})`,
			value: limit,
			unit: "m",
			source: "Jurin 1718 (Jurin's law)"
		});
		const tg = raw.withGravity;
		if (tg === null) warnings.push(warning("BEYOND_JURIN_LIMIT", `A height of ${q(L, "m")} is at or above the Jurin limit of ${q(limit, "m")}: the liquid never gets there, so there is no time to give.`, ["length", "poreRadius"], {
			step: "jurin-limit",
			withholds: ["time", "timeWithGravity"]
		}));
		else if (!inertiaMatters) {
			const x = L / limit;
			const shape = gravityShape(x);
			working.push({
				id: "gravity-shape",
				label: "Height against the Jurin limit, and the shape term",
				formula: "x = h / h_J; −x − ln(1 − x)",
				substituted: `x = ${q(L, "m")} / ${q(limit, "m")} = ${formatValue(x)}`,
				value: shape,
				unit: "1",
				source: WASHBURN
			}, {
				id: "gravity-time",
				label: "Time with gravity",
				formula: "t = (2·h_J² / K)·(−x − ln(1 − x)), K = σ·r·cos θ / (2μ)",
				substituted: `K = ${formatValue(sigma * r * Math.cos(angle.angleDeg * Math.PI / 180) / (2 * mu))} m²/s, 2 × (${q(limit, "m")})² / K × ${formatValue(shape)}`,
				value: tg,
				unit: "s",
				source: WASHBURN
			});
			if (tg / raw.time > GRAVITY_RATIO_LIMIT) warnings.push(warning("GRAVITY_NOT_NEGLIGIBLE", `The height is ${formatValue(x)} of the Jurin limit: gravity slows the rise and the time with gravity (${formatValue(tg / raw.time)} × the Lucas–Washburn time) is the one to use.`, ["length"], { step: "gravity-time" }));
		}
	}
	if (inertiaMatters && !(vertical && raw.withGravity === null)) warnings.push(warning("INERTIA_NOT_NEGLIGIBLE", vertical ? `Inertia lengthens the time by ${formatValue((inertiaRatio - 1) * 100, 3)} % (more than 5 %: the time is under twenty inertial time scales ρr²/(8μ)). The Lucas–Washburn times neglect it, and a rise with both gravity and inertia is not solved here, so no time is given.` : `Inertia lengthens the time by ${formatValue((inertiaRatio - 1) * 100, 3)} % (more than 5 %: the time is under twenty inertial time scales ρr²/(8μ)): the Lucas–Washburn time is withheld; use the time with inertia.`, ["poreRadius", "length"], {
		step: "bosanquet",
		withholds: withheldByInertia
	}));
	const near = nearNinety(angle.angleDeg);
	if (near !== null) warnings.push({
		...near,
		step: "washburn"
	});
	return solved({
		outputs,
		working,
		warnings,
		band: bandOver(angle.basis, outputs, (v) => evaluate(v.contactAngleDeg ?? angle.angleDeg)),
		assumptions: [
			"Laminar flow of a Newtonian liquid in a uniform cylindrical capillary of the effective radius given.",
			"The static contact angle holds while the liquid moves (no dynamic angle).",
			"Clean liquid and clean surfaces: no surfactant, oil or dirt.",
			"Entrance losses and the air displaced ahead of the liquid are neglected.",
			vertical ? "Upward: gravity is included in the time with gravity only; inertia is judged from the horizontal solution." : "Horizontal: gravity plays no part.",
			liquid.assumption,
			angle.assumption,
			gravityAssumption(g)
		]
	}, liquid);
}
var calculator = {
	id: "wicking-time",
	title: "Wicking time",
	summary: "Time for a liquid to wick a given distance along a capillary or porous path by the Lucas–Washburn equation, and for a vertical rise the Jurin limit and the time with gravity.",
	inputs: [
		{
			id: "direction",
			label: "Direction",
			kind: "choice",
			default: "vertical",
			options: [{
				value: "vertical",
				label: "Upward (height)"
			}, {
				value: "horizontal",
				label: "Horizontal (distance)"
			}]
		},
		quantityInput("length", "length", "Height or distance", .05, [1e-6, 100], { display: MM }),
		quantityInput("length", "poreRadius", "Effective capillary radius", 2e-5, [1e-9, .01], {
			help: "For a porous material this is an effective value, best fitted to a measured sorption test.",
			display: {
				si: "um",
				us: "in"
			}
		}),
		...liquidInputs({
			density: true,
			viscosity: true
		}),
		...contactAngleInputs({
			presetIds: ["water-clean-glass", "water-mineral-grains"],
			defaultPreset: "water-clean-glass",
			maxDeg: 180
		}),
		gravityInput()
	],
	outputs: [
		{
			id: "time",
			label: "Time, Lucas–Washburn",
			kind: "time",
			help: "Gravity and inertia neglected."
		},
		{
			id: "timeWithInertia",
			label: "Time with inertia (Bosanquet)",
			kind: "time",
			help: "Horizontal only: viscous drag and the inertia of the liquid."
		},
		{
			id: "jurinLimit",
			label: "Jurin limit (highest possible rise)",
			kind: "length",
			help: "Upward only.",
			display: {
				si: "mm",
				us: "in"
			}
		},
		{
			id: "timeWithGravity",
			label: "Time with gravity",
			kind: "time",
			help: "Upward only, below the Jurin limit."
		}
	],
	headline: {
		rules: [
			{
				warning: "BEYOND_JURIN_LIMIT",
				output: "jurinLimit",
				text: "{liquid} never climbs {input.length}: it stops at about {value}."
			},
			{
				when: [{
					input: "direction",
					values: ["vertical"]
				}],
				output: "timeWithGravity",
				text: "{liquid} takes about {value} to wick {input.length} upward."
			},
			{
				when: [{
					input: "direction",
					values: ["horizontal"]
				}],
				output: "timeWithInertia",
				text: "{liquid} takes about {value} to wick {input.length} along the path."
			},
			{
				when: [{
					input: "direction",
					values: ["vertical"]
				}],
				output: "time",
				text: "{liquid} takes about {value} to wick {input.length} upward."
			},
			{
				output: "time",
				text: "{liquid} takes about {value} to wick {input.length} along the path."
			}
		],
		missing: "time"
	},
	warnings: [
		{
			code: "BEYOND_JURIN_LIMIT",
			summary: "An upward height at or above the Jurin limit is never reached."
		},
		{
			code: "INERTIA_NOT_NEGLIGIBLE",
			summary: "Inertia lengthens the time by more than 5 % (our threshold: the time is under twenty inertial time scales ρr²/(8μ)); the viscous-only times are withheld."
		},
		CONTACT_ANGLE_NEAR_90,
		{
			code: "PORE_TOO_WIDE",
			summary: "The pore radius is at least the capillary length: no time is given."
		},
		{
			code: "GRAVITY_NOT_NEGLIGIBLE",
			summary: "Gravity lengthens the time by more than 5 % (our threshold); use the time with gravity."
		}
	],
	solve
};
// packages/calc-core/dist/calculators/wicking-time.texts.js
var texts = {
	cautions: [
		ESTIMATE_CAUTION,
		{
			code: "REAL_POROUS_MEDIA",
			text: "Real materials have a range of pore sizes, tortuous paths and swelling or dissolving walls; the effective radius has to be fitted to a sorption test on the material itself."
		},
		DAMP_CAUTION,
		CLEAN_SURFACES_CAUTION
	],
	references: [
		{
			id: "washburn-1921",
			citation: "Washburn E. W. (1921) The dynamics of capillary flow, Phys. Rev. 17, 273–283",
			usedFor: "L² = σ r t cos θ/(2μ), and the equation of motion with gravity that gives the time with gravity",
			basis: "printed"
		},
		{
			id: "bosanquet-1923",
			citation: "Bosanquet C. H. (1923) On the flow of liquids into capillary tubes, Phil. Mag. 45, 525–531",
			usedFor: "the time with inertia, d/dt(ρ·x·dx/dt) = 2σ·cos θ/r − 8μ·x·(dx/dt)/r² (citation details from memory)",
			basis: "from memory"
		},
		{
			id: "lucas-1918",
			citation: "Lucas R. (1918) Ueber das Zeitgesetz des kapillaren Aufstiegs von Flüssigkeiten, Kolloid-Z. 23, 15–22",
			usedFor: "the same law, found independently",
			basis: "printed"
		},
		...WATER_REFERENCES,
		VISCOSITY_REFERENCE,
		...LIQUID_TABLE_REFERENCES
	]
};
// packages/calc-core/dist/registry.js
/** A calculator whole: its core (what computes) and its texts (cautions, references). */
function withTexts(core, texts) {
	return {
		...core,
		...texts
	};
}
var tubeRise = withTexts(calculator$2, texts$2);
var slotRise$1 = withTexts(calculator$5, texts$5);
var soilCapillaryRise = withTexts(calculator$4, texts$4);
var interfacePressure = withTexts(calculator$7, texts$7);
var wettingForce = withTexts(calculator$1, texts$1);
var wickingTime = withTexts(calculator, texts);
var contactAngleFromForce = withTexts(calculator$9, texts$9);
var tensionFromRise = withTexts(calculator$3, texts$3);
var risingDampHeight = withTexts(calculator$6, texts$6);
var frostScreening = withTexts(calculator$8, texts$8);
var absorptionCoefficient = withTexts(calculator$10, texts$10);
/** Every calculator, in the order a picker shows them. Registered by hand: nothing registers itself on import. */
var calculators = [
	tubeRise,
	slotRise$1,
	soilCapillaryRise,
	interfacePressure,
	wettingForce,
	wickingTime,
	contactAngleFromForce,
	tensionFromRise,
	risingDampHeight,
	frostScreening,
	absorptionCoefficient
];
var calculatorIds = calculators.map((c) => c.id);
/** A calculator definition by id, or undefined. */
function getCalculator(id) {
	return calculators.find((c) => c.id === id);
}
/**
* Runs a calculator by id.
* @param id a calculator id (`calculatorIds`)
* @param inputs canonical units keyed by input id: SI, angles in degrees, temperatures in °C;
*   missing inputs take their defaults
* @returns outputs (canonical units), warnings, working, band, version and input hash
* @throws CalcInputError `UNKNOWN_CALCULATOR`, or one listing every bad input field
*/
function calculate(id, inputs) {
	const def = getCalculator(id);
	if (def === void 0) throw new CalcInputError({
		field: "calculator",
		code: "UNKNOWN_CALCULATOR",
		message: `no calculator "${id}"`
	});
	return runCalculation(def, inputs);
}
export { CalcInputError, DENSITY_RANGE_C, FIT_WINDOW_S, HAZEN_C_RANGE_M2, IAPWS2008_RANGE_K, MERCURY_HAZARD, STANDARD_GRAVITY, SURFACE_TENSION_RANGE_C, VERSION, VISCOSITY_RANGE_C, absorptionCoefficient as absorptionCoefficientCalculator, absorptionPoints, bubblePressure, calculate, calculatorIds, calculators, canonicalJson, canonicalUnits, capillaryBreakCheck, capillaryLength, cellName, cgsUnits, conditionsHold, contactAngleFromForce as contactAngleFromForceCalculator, contactAnglePresets, convert, converter, displayUnit, displayUnitOf, duNouySurfaceTension, fitLine, formatInput, formatResult, formatValue, fromCanonical, fromCanonicalTo, frostScreening as frostScreeningCalculator, getCalculator, getContactAnglePreset, getLiquid, getUnit, gravityRestrainedRiseTime, hashInputs, hazenCapillaryRise, headline, iapws2008Viscosity, inFitWindow, inReaderUnits, inputApplies, interfacePressure as interfacePressureCalculator, isSecondaryOutput, jurinRise, laplacePressure, liquids, meniscusCorrection, optionsFor, outputHelp, parseNumber, parseTableField, plainInputs, platePerimeter, poreEntryPressure, practicalDefault, quantityKinds, readWarning, readable, readableUnit, referencesFor, resolveInputs, resultsAgree, risingDampHeight as risingDampHeightCalculator, rowsFromCells, runCalculation, sha256Hex, showTable, slotMeniscusCorrection, slotRise, slotRise$1 as slotRiseCalculator, soilCapillaryRise as soilCapillaryRiseCalculator, tableField, tableIssues, tableRows, tableSummary, tensionFromRise as tensionFromRiseCalculator, toCanonical, tubeRise as tubeRiseCalculator, unitGap, unitSymbol, unitSystems, units, warningTitle, washburnLength, washburnTime, water, waterDensity, waterSurfaceTension, waterViscosity, wettingForce as wettingForceCalculator, wickingTime as wickingTimeCalculator, wilhelmyForce, wilhelmyRodForce, wilhelmyRodSurfaceTension, wilhelmySurfaceTension, withTexts, withUnit };
