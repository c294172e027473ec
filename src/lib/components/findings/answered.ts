import type { SubmitFunction } from '@sveltejs/kit';
import type { ActionResult } from '@sveltejs/kit';

/**
 * The finding forms post to the finding page's actions, from that page or from the board. On
 * the page the answer updates it as usual; elsewhere `onresult` takes it (the board reads the
 * finding again) and a form that succeeded is emptied. `then` runs first either way.
 */
export function answered(
	onresult: ((result: ActionResult) => void) | undefined,
	then?: () => void
): SubmitFunction {
	return ({ formElement }) =>
		async ({ result, update }) => {
			then?.();
			if (!onresult) return update();
			if (result.type === 'success') formElement.reset();
			onresult(result);
		};
}
