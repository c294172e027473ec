import type { FeatureJson, NewFeature } from '$lib/features';
import type { BoardState } from './board.svelte';
import type { Answer, FeatureApi } from './feature-api';
import { featureIdOf, featureMarker, type Location } from './feature-form';
import type { Marker } from './markers';

/** What the side panel shows: a feature, a feature being added, or the revision itself. */
export type Selection =
	{ kind: 'feature'; id: string } | { kind: 'new'; location: Location | null } | null;

/** The marker of a feature not yet saved (its balloon comes from the server on saving). */
export const newMarkerId = 'feature-new';

type Placed = FeatureJson & { location: Location };
const isPlaced = (f: FeatureJson): f is Placed => f.location !== null;

/**
 * The features on the board: the list as the API answered it, their markers, what is selected,
 * place mode, and the writes (each through the JSON API; a stale write shows the current state).
 */
export class FeatureBoard {
	features = $state.raw<FeatureJson[]>([]);
	selection = $state.raw<Selection>(null);
	/** A short word on the last write that the panel shows (a refusal, a stale edit). */
	notice = $state<{ tone: 'error' | 'info'; text: string } | null>(null);
	board: BoardState | null = $state.raw(null);
	/**
	 * What the person had typed when someone else's change came first (a stale save, or a live
	 * change to the feature open in the panel): kept aside to re-apply, never silently dropped.
	 */
	conflict = $state.raw<{ id: string; mine: Partial<NewFeature> } | null>(null);
	/** The open panel's unsaved changes (set by the panel), so a live change does not eat them. */
	editing: { id: string; changes: Partial<NewFeature> } | null = null;
	#placingFor: string | null = null;
	/** Features with a save of ours under way: their answer, not an event, says what they became. */
	#saving: string[] = [];
	/** Others' changes that came during such a save, shown once it is answered. */
	#deferred: Record<string, FeatureJson> = {};

	constructor(
		readonly api: FeatureApi,
		features: FeatureJson[],
		/** May this person edit here (capability and a revision not frozen)? */
		readonly editable: boolean
	) {
		this.features = features;
	}

	/** Place mode: 'new' places a new feature, an id places that feature from the tray. */
	get placingFor() {
		return this.board?.placing ? this.#placingFor : null;
	}

	get placed() {
		return this.features.filter(isPlaced);
	}

	get unplaced() {
		return this.features.filter((f) => !isPlaced(f));
	}

	get selected() {
		const s = this.selection;
		return s?.kind === 'feature' ? (this.features.find((f) => f.id === s.id) ?? null) : null;
	}

	#marker = (f: Placed): Marker => featureMarker(f, this.editable);

	attach(board: BoardState) {
		this.board = board;
		board.addMarkers(this.placed.map(this.#marker));
	}

	/** Puts a feature as the server answered it into the list and onto the board. */
	#put(feature: FeatureJson) {
		const known = this.features.some((f) => f.id === feature.id);
		this.features = known
			? this.features.map((f) => (f.id === feature.id ? feature : f))
			: [...this.features, feature].sort((a, b) => a.balloon - b.balloon);
		if (isPlaced(feature)) this.board?.addMarkers([this.#marker(feature)]);
		else this.board?.removeMarkers([`feature-${feature.id}`]);
	}

	startPlacing(what: 'new' | string) {
		if (!this.editable || !this.board) return;
		this.#placingFor = what;
		const feature = this.features.find((f) => f.id === what);
		this.board.startPlacing(
			feature
				? `Click where balloon ${feature.balloon} stands · Escape cancels`
				: 'Click where the feature stands · Escape cancels'
		);
	}

	stopPlacing() {
		this.#placingFor = null;
		this.board?.stopPlacing();
	}

	/** The sheet was clicked in place mode, or a feature from the tray dropped on it. */
	onplace = (location: Location, item: string | null) => {
		const target = item ?? this.placingFor;
		this.stopPlacing();
		if (!target || !this.editable) return;
		if (target !== 'new') {
			void this.move(target, location);
			return;
		}
		this.board?.addMarkers([
			{
				id: newMarkerId,
				label: '+',
				title: 'New feature',
				location,
				tone: 'feature',
				movable: true
			}
		]);
		this.board?.select(newMarkerId);
		this.selection = { kind: 'new', location };
	};

	onselect = (marker: Marker | null) => {
		const id = marker ? featureIdOf(marker.id) : null;
		if (id === 'new') return;
		if (this.selection?.kind === 'new') this.cancelNew();
		this.selection = id ? { kind: 'feature', id } : null;
	};

	/** Shows a feature: flies to its marker when it is placed, else only selects it. */
	show(id: string) {
		const feature = this.features.find((f) => f.id === id);
		if (feature?.location && this.board?.flyTo(`feature-${id}`)) return;
		this.board?.select(null);
		this.selection = { kind: 'feature', id };
	}

	addUnplaced() {
		this.board?.select(null);
		this.selection = { kind: 'new', location: null };
	}

	cancelNew() {
		this.board?.removeMarkers([newMarkerId]);
		if (this.selection?.kind === 'new') this.selection = null;
	}

	close() {
		if (this.selection?.kind === 'new') this.cancelNew();
		this.board?.select(null);
		this.selection = null;
	}

	/** A refused write: a stale one shows the feature as it is now. */
	#refused(
		answer: Exclude<Answer<unknown>, { ok: true }>,
		balloon?: number,
		mine?: Partial<NewFeature>
	) {
		if (answer.code === 'stale' && answer.current) {
			if (mine && Object.keys(mine).length > 0) this.conflict = { id: answer.current.id, mine };
			this.#put(answer.current);
			this.notice = {
				tone: 'error',
				text: `Someone changed balloon ${answer.current.balloon} since you loaded it: your change was not applied. This is the feature as it stands now.`
			};
		} else if (answer.status === 404 && balloon !== undefined) {
			this.notice = { tone: 'error', text: `Balloon ${balloon} was deleted meanwhile.` };
		} else if (answer.status !== 400) {
			this.notice = { tone: 'error', text: answer.message };
		}
	}

	async create(input: NewFeature) {
		this.notice = null;
		const answer = await this.api.create(input);
		if (!answer.ok) {
			this.#refused(answer);
			return answer;
		}
		this.board?.removeMarkers([newMarkerId]);
		this.#put(answer.value);
		this.selection = { kind: 'feature', id: answer.value.id };
		if (answer.value.location) this.board?.select(`feature-${answer.value.id}`);
		this.notice = { tone: 'info', text: `Balloon ${answer.value.balloon} added.` };
		return answer;
	}

	async save(feature: FeatureJson, changes: Partial<NewFeature>) {
		this.notice = null;
		this.#saving = [...this.#saving, feature.id];
		const answer = await this.api.edit(feature.id, feature.version, changes);
		const i = this.#saving.indexOf(feature.id);
		this.#saving = this.#saving.filter((_, at) => at !== i);
		const later = this.#deferred[feature.id];
		delete this.#deferred[feature.id];
		if (answer.ok) {
			if (this.conflict?.id === feature.id) this.conflict = null;
			this.#put(later && later.version > answer.value.version ? later : answer.value);
			this.notice = { tone: 'info', text: `Balloon ${answer.value.balloon} saved.` };
		} else this.#refused(answer, feature.balloon, changes);
		return answer;
	}

	/** Places or moves a feature's marker (dragged, or dropped from the tray). */
	async move(id: string, location: Location) {
		const feature = this.features.find((f) => f.id === id);
		if (!feature) return;
		const answer = await this.save(feature, { location });
		if (!answer.ok && answer.code !== 'stale') {
			// Back where it was.
			if (isPlaced(feature)) this.board?.addMarkers([this.#marker(feature)]);
			else this.board?.removeMarkers([`feature-${id}`]);
		}
		if (answer.ok) this.show(id);
	}

	onmove = (marker: Marker, location: Location) => {
		const id = featureIdOf(marker.id);
		if (id && id !== 'new') void this.move(id, location);
		else if (id === 'new' && this.selection?.kind === 'new') {
			this.selection = { kind: 'new', location };
		}
	};

	async remove(feature: FeatureJson) {
		this.notice = null;
		const answer = await this.api.remove(feature.id, feature.version);
		if (answer.ok || answer.status === 404) {
			this.features = this.features.filter((f) => f.id !== feature.id);
			this.board?.removeMarkers([`feature-${feature.id}`]);
			this.close();
			this.notice = { tone: 'info', text: `Balloon ${feature.balloon} deleted.` };
		} else this.#refused(answer, feature.balloon);
		return answer;
	}

	/**
	 * Someone else's change, as the server has it now (a live event): shown at once. When it is
	 * the feature open with unsaved changes, those are kept aside as a conflict to re-apply.
	 */
	applyRemote(feature: FeatureJson) {
		const known = this.features.find((f) => f.id === feature.id);
		if (known && known.version >= feature.version) return;
		if (this.#saving.includes(feature.id)) {
			this.#deferred[feature.id] = feature;
			return;
		}
		const editing = this.editing;
		if (known && editing?.id === feature.id && Object.keys(editing.changes).length > 0) {
			this.conflict = { id: feature.id, mine: editing.changes };
		}
		this.#put(feature);
	}

	/** A feature someone else deleted. */
	forget(id: string) {
		const gone = this.features.find((f) => f.id === id);
		if (!gone) return;
		this.features = this.features.filter((f) => f.id !== id);
		this.board?.removeMarkers([`feature-${id}`]);
		if (this.selection?.kind === 'feature' && this.selection.id === id) {
			this.close();
			this.notice = { tone: 'error', text: `Someone deleted balloon ${gone.balloon}.` };
		}
	}

	/** Reads every feature again (after the revision's settings changed, say). */
	async reload() {
		const answer = await this.api.list();
		if (!answer.ok) return;
		const gone = this.features.filter((f) => !answer.value.some((n) => n.id === f.id));
		this.board?.removeMarkers(gone.map((f) => `feature-${f.id}`));
		this.features = [];
		for (const f of answer.value) this.#put(f);
	}
}
