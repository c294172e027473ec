/*
 * What the board does with live changes: a feature changed by someone else is read again and
 * shown (`FeatureBoard.applyRemote`), a deleted one leaves, and a change of the revision itself
 * (its settings move every computed value) reads all features again. Findings, fits and
 * comments are handed to whoever follows them (`LiveRevision.on`).
 */
import type { FeatureBoard } from './feature-board.svelte';
import type { FindingBoard } from './finding-board.svelte';
import type { LiveRevision } from './live.svelte';

export function followFeatures(live: LiveRevision, features: FeatureBoard) {
	const stops = [
		live.on('feature', async (event) => {
			if (event.action === 'delete') {
				features.forget(event.id);
				return;
			}
			const known = features.features.find((f) => f.id === event.id);
			if (known && event.version !== null && known.version >= event.version) return;
			const answer = await features.api.get(event.id);
			if (answer.ok) features.applyRemote(answer.value);
			else if (answer.status === 404) features.forget(event.id);
		}),
		live.on('revision', () => void features.reload())
	];
	return () => stops.forEach((stop) => stop());
}

/** Findings others raised or changed are read again; a rulebook re-check reads them all. */
export function followFindings(live: LiveRevision, findings: FindingBoard) {
	return live.on('finding', (event) => {
		void (event.action === 'recheck' ? findings.reload() : findings.refresh(event.id));
	});
}
