/*
 * What the feature rules read beside the feature itself: the drawing, the team, the datum
 * letters defined, and the fits the feature is a member of.
 */
import type { GeometricControl } from '../feature';
import type { RulebookDrawing, RulebookFit, RulebookTeam } from './types';

export interface Membership {
	fit: RulebookFit;
	role: 'hole' | 'shaft' | 'fixed-hole';
}

export interface FeatureEnv {
	drawing: RulebookDrawing;
	team: RulebookTeam | undefined;
	datumLetters: { has(letter: string): boolean; list(): string[] };
	memberships: readonly Membership[];
}

/** The ids of the fits a feature is a member of, for a readable line. */
export function fitList(env: FeatureEnv): string {
	const ids: string[] = [];
	for (const m of env.memberships) ids.push(m.fit.id);
	return ids.join(', ');
}

/** A name per control that stays put when other controls are added: characteristic, then a count. */
export function controlCauses(controls: readonly GeometricControl[]): string[] {
	const seen = new Map<string, number>();
	const causes: string[] = [];
	for (const c of controls) {
		const n = (seen.get(c.characteristic) ?? 0) + 1;
		seen.set(c.characteristic, n);
		causes.push(n === 1 ? c.characteristic : `${c.characteristic}#${n}`);
	}
	return causes;
}
