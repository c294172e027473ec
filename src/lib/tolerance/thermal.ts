/*
 * A fit at its operating temperature: both members expand from the reference temperature of
 * 20 °C (ISO 1) by their own linear coefficients, ΔL = L·α·Δθ.
 */
import { mulDivBig, parseDecimal, type Length } from './decimal';

export interface TemperatureInput {
	/** Operating temperature in °C; the standard reference temperature is 20 °C (ISO 1). */
	operating: string;
	/** Linear expansion coefficients in 10⁻⁶/K (µm per m and kelvin). */
	holeCoefficient: string;
	shaftCoefficient: string;
}

/** The temperature and coefficients read exactly: decimals × 10⁷ (read on the mm grid). */
export interface Thermal {
	operating: string;
	deltaT: bigint;
	hole: bigint;
	shaft: bigint;
}

const SCALE = 10n ** 20n;
const REFERENCE = 20n * 10_000_000n;

function readScaled(text: string): bigint | null {
	const v = parseDecimal(text.trim(), 'mm');
	return v === null ? null : BigInt(v.value);
}

/** The input read, or null when a number cannot be read. */
export function readThermal(input: TemperatureInput): Thermal | null {
	const operating = readScaled(input.operating);
	const hole = readScaled(input.holeCoefficient);
	const shaft = readScaled(input.shaftCoefficient);
	if (operating === null || hole === null || shaft === null) return null;
	return { operating: input.operating.trim(), deltaT: operating - REFERENCE, hole, shaft };
}

/** value × (1 + α·Δθ·10⁻⁶), one rounding to the grid (half away from zero). */
export function expand(value: Length, alpha: bigint, deltaT: bigint): Length {
	// alpha and deltaT carry 10⁷ each, so α·Δθ carries 10¹⁴, and α·Δθ·10⁻⁶ carries 10²⁰.
	return mulDivBig(value, SCALE + alpha * deltaT, SCALE, 'nearest');
}
