import {
	editRefused,
	findingIdOf,
	findingMarker,
	findingMarkerId,
	findingName,
	type FindingJson,
	type FindingPowers,
	type NewFinding
} from '$lib/findings';
import type { BoardState } from './board.svelte';
import type { FindingApi } from './finding-api';
import type { Marker, MarkerLocation } from './markers';

/** What the side panel shows of findings: one finding, or one being raised at a place. */
export type FindingSelection =
	{ kind: 'finding'; id: string } | { kind: 'new'; location: MarkerLocation } | null;

/** The marker of a finding being raised (its number comes from the server on raising). */
export const newFindingMarkerId = findingMarkerId('new');

type Placed = FindingJson & { location: MarkerLocation };
const isPlaced = (f: FindingJson): f is Placed => f.location !== null;

/**
 * The findings on the board: the revision's list as the API answered it, their markers, the one
 * selected, raise mode (a click at a point or a drag around an area) and the writes, each
 * through the JSON API, which decides; a refused write shows the finding as it stands.
 */
export class FindingBoard {
	findings = $state.raw<FindingJson[]>([]);
	selection = $state.raw<FindingSelection>(null);
	notice = $state<{ tone: 'error' | 'info'; text: string } | null>(null);
	board: BoardState | null = $state.raw(null);
	#raising = $state(false);

	constructor(
		readonly api: FindingApi,
		findings: FindingJson[],
		/** What this person may do to findings. */
		readonly powers: FindingPowers,
		/** An approved or released revision: findings change no more (comments still may). */
		readonly frozen: boolean
	) {
		this.findings = findings;
	}

	get mayRaise() {
		return this.powers.raise && !this.frozen;
	}

	/** May this person move the finding's marker (edit its place)? */
	mayEdit(f: Pick<FindingJson, 'number' | 'raisedBy'>) {
		return !this.frozen && editRefused(this.powers, f) === null;
	}

	get raising() {
		return this.#raising && this.board?.placing != null;
	}

	get selected() {
		const s = this.selection;
		return s?.kind === 'finding' ? (this.findings.find((f) => f.id === s.id) ?? null) : null;
	}

	#marker = (f: Placed): Marker => findingMarker(f, this.mayEdit(f));

	attach(board: BoardState) {
		this.board = board;
		board.addMarkers(this.findings.filter(isPlaced).map(this.#marker));
	}

	/** Puts a finding as the server answered it into the list and onto the board. */
	#put(finding: FindingJson) {
		const known = this.findings.some((f) => f.id === finding.id);
		this.findings = known
			? this.findings.map((f) => (f.id === finding.id ? finding : f))
			: [...this.findings, finding].sort((a, b) => a.number - b.number);
		if (isPlaced(finding)) this.board?.addMarkers([this.#marker(finding)]);
		else this.board?.removeMarkers([findingMarkerId(finding.id)]);
	}

	startRaising() {
		if (!this.mayRaise || !this.board) return;
		this.board.startPlacing(
			'Click a point or drag around an area to raise a finding · Escape cancels',
			true
		);
		this.#raising = true;
	}

	stopRaising() {
		this.#raising = false;
		this.board?.stopPlacing();
	}

	/** In raise mode the sheet was clicked or an area dragged out: the form asks for the rest. */
	onplace = (location: MarkerLocation) => {
		this.stopRaising();
		if (!this.mayRaise) return;
		this.board?.addMarkers([
			{
				id: newFindingMarkerId,
				label: 'F-?',
				title: 'New finding',
				location,
				tone: 'finding',
				shape: 'tag',
				...(location.w !== undefined && { outline: 'cloud' as const }),
				movable: true
			}
		]);
		this.board?.select(newFindingMarkerId);
		this.selection = { kind: 'new', location };
	};

	onselect = (marker: Marker | null) => {
		const id = marker ? findingIdOf(marker.id) : null;
		if (id === 'new') return;
		if (this.selection?.kind === 'new') this.cancelNew();
		this.selection = id ? { kind: 'finding', id } : null;
		if (id) void this.refresh(id);
	};

	/** Shows a finding: flies to its marker when it is placed, else only selects it. */
	show(id: string) {
		const finding = this.findings.find((f) => f.id === id);
		if (finding?.location && this.board?.flyTo(findingMarkerId(id))) return;
		this.board?.select(null);
		this.selection = { kind: 'finding', id };
	}

	cancelNew() {
		this.board?.removeMarkers([newFindingMarkerId]);
		if (this.selection?.kind === 'new') this.selection = null;
	}

	close() {
		if (this.selection?.kind === 'new') this.cancelNew();
		this.board?.select(null);
		this.selection = null;
	}

	/** Raises the finding at the place picked; the API checks the rest. */
	async raise(input: Omit<NewFinding, 'location'>) {
		if (this.selection?.kind !== 'new') return null;
		this.notice = null;
		const answer = await this.api.raise({ ...input, location: this.selection.location });
		if (!answer.ok) {
			if (answer.status !== 400) this.notice = { tone: 'error', text: answer.message };
			return answer;
		}
		this.board?.removeMarkers([newFindingMarkerId]);
		this.#put(answer.value);
		this.selection = { kind: 'finding', id: answer.value.id };
		this.board?.select(findingMarkerId(answer.value.id));
		this.notice = { tone: 'info', text: `${findingName(answer.value.number)} raised.` };
		return answer;
	}

	/** Reads every finding again (the rulebook changed several at once). */
	async reload() {
		const answer = await this.api.list();
		if (!answer.ok) return;
		const gone = this.findings.filter((f) => !answer.value.some((g) => g.id === f.id));
		this.board?.removeMarkers(gone.map((f) => findingMarkerId(f.id)));
		for (const f of answer.value) this.#put(f);
	}

	/** Reads one finding again (its state, history and version) after a change elsewhere. */
	async refresh(id: string) {
		const answer = await this.api.get(id);
		if (answer.ok) this.#put(answer.value);
		else if (answer.status === 404) {
			this.findings = this.findings.filter((f) => f.id !== id);
			this.board?.removeMarkers([findingMarkerId(id)]);
			if (this.selection?.kind === 'finding' && this.selection.id === id) this.close();
		}
	}

	/** A finding's marker was dragged: its new place is saved, or it goes back. */
	async move(id: string, location: MarkerLocation) {
		const finding = this.findings.find((f) => f.id === id);
		if (!finding) return;
		this.notice = null;
		const answer = await this.api.change(id, { version: finding.version, location });
		if (answer.ok) {
			this.#put(answer.value);
			return;
		}
		const current = answer.current ?? finding;
		this.#put(current);
		this.notice = {
			tone: 'error',
			text:
				answer.code === 'stale'
					? `Someone changed ${findingName(finding.number)} since you loaded it: it was not moved. This is where it stands now.`
					: `${findingName(finding.number)} was not moved: ${answer.message}`
		};
	}

	onmove = (marker: Marker, location: MarkerLocation) => {
		const id = findingIdOf(marker.id);
		if (id === 'new' && this.selection?.kind === 'new') this.selection = { kind: 'new', location };
		else if (id && id !== 'new') void this.move(id, location);
	};
}
