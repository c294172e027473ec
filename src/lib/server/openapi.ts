import { z } from 'zod';
import { adviseInput, fitInput, sizeInput, sizeQuery } from '$lib/schemas/calc';
import { drawingInput, drawingPatch, revisionPatch } from '$lib/schemas/drawings';
import {
	deleteQuery,
	featureInput,
	featureMatch,
	featurePatch,
	featureResponse,
	featureSearchQuery
} from '$lib/schemas/features';
import { fitCreate, fitPatch, fitResponse } from '$lib/schemas/fits';
import {
	commentInput,
	commentResponse,
	findingInput,
	findingPatch,
	checkSummaryResponse,
	findingQuery,
	findingResponse
} from '$lib/schemas/findings';
import { importDescription } from '$lib/schemas/feature-import';
import { eventsQuery } from '$lib/schemas/events';
import { transitionInput, transitionResponse } from '$lib/schemas/transitions';
import {
	activityQuery,
	apiTokenInput,
	invitationResponse,
	memberInput,
	openInvitation,
	roleInput,
	teamInput,
	teamPatch,
	teamSettingsResponse
} from '$lib/schemas/teams';

type Method = 'get' | 'post' | 'patch' | 'delete';
interface Operation {
	summary: string;
	body?: z.ZodType;
	multipart?: boolean;
	/** A CSV file: a text/csv body, or multipart with the field `file`. */
	csv?: boolean;
	/** A longer description (Markdown) beside the summary. */
	description?: string;
	query?: z.ZodObject;
	public?: boolean;
	success: number;
	produces?: string;
	/** The success answer's shape, when the document describes it. */
	response?: z.ZodType;
}

/**
 * The API map of PRODUCT.md §6. Request bodies come from the same zod schemas the routes and
 * forms validate with; a unit test keeps this list and the route files in step.
 */
export const operations: Record<string, Partial<Record<Method, Operation>>> = {
	'/me': { get: { summary: 'The signed-in user', success: 200 } },
	'/me/tokens': {
		get: { summary: 'Your personal API tokens (never the secrets)', success: 200 },
		post: {
			summary: 'Create a token (signed in, not with a token); the secret is in this answer only',
			body: apiTokenInput,
			success: 201
		}
	},
	'/me/tokens/{id}': { delete: { summary: 'Revoke a token', success: 204 } },
	'/teams': {
		get: { summary: 'Your teams with your role in each', success: 200 },
		post: { summary: 'Create a team; you become its admin', body: teamInput, success: 201 }
	},
	'/teams/{team}': {
		get: {
			summary:
				"The team's settings (self-approval, the rulebook's severities, the capability grade)",
			response: teamSettingsResponse,
			success: 200
		},
		patch: {
			summary:
				"Change the team's settings with `version` (admin): `allowSelfApproval`, `severityOverrides` (rule code → severity; the catalogue's severities are defaults) and `capabilityGrade` (the IT grade LIM-06 compares with, or null). The team's revisions that are not frozen are re-checked at once; 409 stale with the current settings",
			body: teamPatch,
			response: teamSettingsResponse,
			success: 200
		}
	},
	'/teams/{team}/members': {
		get: { summary: 'Members and their roles', success: 200 },
		post: {
			summary:
				"Invite someone by e-mail: always an invitation they accept (202 with the invitation), whether the address has an account or not; 429 rate_limited with Retry-After past the inviter's limit",
			body: memberInput,
			response: invitationResponse,
			success: 202
		}
	},
	'/teams/{team}/members/{userId}': {
		patch: {
			summary: "Change a member's role (never the last admin)",
			body: roleInput,
			success: 200
		},
		delete: { summary: 'Remove a member (never the last admin)', success: 204 }
	},
	'/teams/{team}/invitations': {
		get: {
			summary:
				'Open invitations; `waitingFor` names an account of another address that asked to accept one (approve it with POST …/approval)',
			response: z.array(openInvitation),
			success: 200
		},
		post: {
			summary: 'Invite by e-mail (as POST …/members, answered 201)',
			body: memberInput,
			response: invitationResponse,
			success: 201
		}
	},
	'/teams/{team}/invitations/{id}': { delete: { summary: 'Withdraw an invitation', success: 204 } },
	'/teams/{team}/invitations/{id}/approval': {
		post: {
			summary:
				'Let the account waiting on an open invitation (`waitingFor`) join with the invited role; 404 when none is waiting',
			success: 204
		}
	},
	'/teams/{team}/activity': {
		get: {
			summary: 'The append-only activity trail, newest first',
			query: activityQuery,
			success: 200
		}
	},
	'/teams/{team}/features': {
		get: {
			summary:
				'Find features on any drawing of the team (to pair in a fit): every word of q matches the drawing number, label or callout, or the balloon (12 or #12); newest revision first; supplier quality finds released revisions only',
			query: featureSearchQuery,
			response: z.array(featureMatch),
			success: 200
		}
	},
	'/teams/{team}/drawings': {
		get: { summary: 'Drawings with their latest revision', success: 200 },
		post: { summary: 'Create a drawing', body: drawingInput, success: 201 }
	},
	'/teams/{team}/drawings/{number}': {
		get: { summary: 'A drawing and its revisions', success: 200 },
		patch: {
			summary: 'Edit a drawing; a stale version answers 409 stale with the current drawing',
			body: drawingPatch,
			success: 200
		}
	},
	'/teams/{team}/drawings/{number}/revisions': {
		get: { summary: 'Revisions, newest first', success: 200 },
		post: {
			summary: 'Upload a revision: multipart with `file` (PDF), optional `reason` and `letter`',
			multipart: true,
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}': {
		get: { summary: 'One revision', success: 200 },
		patch: {
			summary:
				'Correct the reason for the change or edit the settings (units, standard, general tolerance) while not frozen',
			body: revisionPatch,
			success: 200
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/transitions': {
		get: {
			summary: "The revision's state changes, oldest first: from, to, who, when and the message",
			response: z.array(transitionResponse),
			success: 200
		},
		post: {
			summary:
				'Move the revision `{to, message}`: submit (draft → in-check) and resubmit (returned → in-check) by an author; return (in-check → returned, message required), approve (in-check → approved), release (approved → released; the previously released revision becomes superseded) and reopen (approved → in-check, message required) by a checker or admin. 409 invalid_transition for a move the states do not have, 403 forbidden for a move your role may not make, 403 separation_of_duties to approve what you uploaded or submitted (unless the team allows self-approval), 409 open_findings listing the open critical and major findings that are not waived. Answers the move with the revision as it now stands',
			body: transitionInput,
			response: transitionResponse.extend({ revision: z.record(z.string(), z.unknown()) }),
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/file': {
		get: {
			summary: 'The PDF, streamed through the app, with HTTP Range support',
			success: 200,
			produces: 'application/pdf'
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/events': {
		get: {
			summary:
				"The revision's changes as server-sent events, live: `event: change`, `id:` a durable sequence number, data `{type, action, id, version}` (a comment adds `subject`, its thread)",
			description:
				'`type` is `feature`, `fit`, `finding`, `comment` or `revision`. Reconnecting with the `Last-Event-ID` header (or `?after=`) first sends what was missed, read from the database; without either the stream starts now. A heartbeat comment comes every 15 s. The stream checks access when it opens and ends with `event: end` once the member may no longer see the revision (removed from the team; supplier quality, a revision not released); on shutdown it ends with a `retry:` hint.',
			query: eventsQuery,
			success: 200,
			produces: 'text/event-stream'
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/features': {
		get: {
			summary: 'Features of size on the revision, balloon order, with computed values and findings',
			response: z.array(featureResponse),
			success: 200
		},
		post: {
			summary:
				'Add a feature (next balloon of the drawing); a bad callout answers 400 with `position`, a frozen revision 409 frozen',
			body: featureInput,
			response: featureResponse,
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/features/{id}': {
		get: { summary: 'One feature', response: featureResponse, success: 200 },
		patch: {
			summary:
				'Edit or move a feature; 409 stale with the current feature, 409 frozen on approved and released revisions',
			body: featurePatch,
			response: featureResponse,
			success: 200
		},
		delete: {
			summary:
				'Delete a feature (its balloon is not reused); 409 in_use while a fit uses it (delete the fit first)',
			query: deleteQuery,
			success: 204
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/fits': {
		get: {
			summary:
				"Fits listed on the revision: those of its holes (owned: true) and those whose shaft is one of its features (owned: false, read-only here), each member computed under its own revision's settings",
			response: z.array(fitResponse),
			success: 200
		},
		post: {
			summary:
				'Add a fit to the revision of its hole: the other member is a feature of any drawing of the team (shaftFeatureId) or a bought fastener {callout, label}; 400 for a bad member or value, 409 frozen',
			body: fitCreate,
			response: fitResponse,
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/fits/{id}': {
		get: { summary: 'One fit with its computed values', response: fitResponse, success: 200 },
		patch: {
			summary:
				"Edit a fit through its hole's revision; 409 stale with the current fit, 409 frozen, 409 not_owner through the other member's revision",
			body: fitPatch,
			response: fitResponse,
			success: 200
		},
		delete: {
			summary: "Delete a fit through its hole's revision",
			query: deleteQuery,
			success: 204
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/findings': {
		get: {
			summary:
				'Findings on the revision by number, filtered by any of kind, state (comma-separated; `open` = raised or answered), severity, assigneeId (`none`: unassigned), rule, family (LIM, ENV, GEO, FIT, DOC), waived (true or false), featureId, fitId',
			query: findingQuery,
			response: z.array(findingResponse),
			success: 200
		},
		post: {
			summary:
				"Raise a finding (the drawing's next number, F-n, never reused) at a point or an area; 400 for empty text, an unknown feature or fit, or an assignee who is not a member or may not answer findings; 409 frozen",
			body: findingInput,
			response: findingResponse,
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/check': {
		post: {
			summary:
				"Run the rulebook in full on the revision (checker or admin) and answer its check summary: rule findings open, waived and closed, by severity and by rule family. Every change to the revision's settings, features and fits already re-checks what it touches; 409 frozen",
			response: checkSummaryResponse,
			success: 200
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/findings/{id}': {
		get: {
			summary: 'One finding with the history of its state changes',
			response: findingResponse,
			success: 200
		},
		patch: {
			summary:
				'Change the state `{state, message, version}` (answer: the assignee; resolve, verify, withdraw, reopen: a checker or admin; a message is required to withdraw or reopen), waive an open rule finding `{waiver: {reason} | null, version}`, or edit the fields with `version`; 403 for a move your role may not make, 409 invalid_transition for a move the states do not have, 409 stale with the current finding, 409 frozen',
			body: findingPatch,
			response: findingResponse,
			success: 200
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/findings/{id}/comments': {
		get: {
			summary: "The finding's thread, oldest first",
			response: z.array(commentResponse),
			success: 200
		},
		post: {
			summary:
				'Comment on a finding: `body` in the comment format (paragraphs, lists, code, links; `@name` mentions members of the team), answered with `html` rendered and sanitized; supplier quality comments on released revisions only',
			body: commentInput,
			response: commentResponse,
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/findings/{id}/comments/{commentId}': {
		patch: {
			summary:
				"Edit your own comment within 10 minutes of posting it (it shows as edited); 403 for another's, 409 too_late after",
			body: commentInput,
			response: commentResponse,
			success: 200
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/features/{id}/comments': {
		get: {
			summary: "The feature's thread, oldest first",
			response: z.array(commentResponse),
			success: 200
		},
		post: {
			summary: 'Comment on a feature (as on a finding)',
			body: commentInput,
			response: commentResponse,
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/features/{id}/comments/{commentId}': {
		patch: {
			summary: 'Edit your own comment on a feature within 10 minutes of posting it',
			body: commentInput,
			response: commentResponse,
			success: 200
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/features/import': {
		post: {
			summary:
				'Import features from CSV (all or nothing); 422 invalid_rows names each bad row by its line',
			description: importDescription,
			csv: true,
			response: z.array(featureResponse),
			success: 201
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/export/features.csv': {
		get: {
			summary:
				"The revision's features as CSV (UTF-8 with a byte order mark; the API's values; cells that could run as a formula are neutralised with a leading apostrophe)",
			success: 200,
			produces: 'text/csv'
		}
	},
	'/teams/{team}/drawings/{number}/revisions/{letter}/export/fits.csv': {
		get: {
			summary:
				'The fits listed on the revision as CSV (as features.csv: byte order mark, neutralised cells)',
			success: 200,
			produces: 'text/csv'
		}
	},
	'/calc/size': {
		get: {
			summary: 'Limits, MMC/LMC, envelope and gauges of one callout',
			query: sizeQuery,
			public: true,
			success: 200
		},
		post: {
			summary: 'The same with geometric tolerances, an actual size or a general tolerance',
			body: sizeInput,
			public: true,
			success: 200
		}
	},
	'/calc/fit': {
		post: {
			summary: 'Clearances and classification of a fit',
			body: fitInput,
			public: true,
			success: 200
		}
	},
	'/calc/advise': {
		post: {
			summary: 'Proposed hole and shaft classes for a fit',
			body: adviseInput,
			public: true,
			success: 200
		}
	}
};

const jsonSchema = (schema: z.ZodType) =>
	z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', target: 'openapi-3.0' });

/** The error codes the API answers with today, by status (PRODUCT.md §6): add each new one. */
export const errorCodes: Record<number, string[]> = {
	400: ['invalid'],
	401: ['unauthenticated'],
	403: ['forbidden', 'separation_of_duties'],
	404: ['not_found'],
	405: ['method_not_allowed'],
	409: [
		'conflict',
		'stale',
		'frozen',
		'in_use',
		'not_owner',
		'invalid_transition',
		'too_late',
		'open_findings'
	],
	413: ['too_large'],
	415: ['not_pdf', 'unsupported_media_type'],
	422: ['unreadable_pdf', 'encrypted_pdf', 'too_many_pages', 'duplicate_revision', 'invalid_rows'],
	429: ['rate_limited'],
	500: ['internal']
};

const responseSchema = (schema: z.ZodType) =>
	z.toJSONSchema(schema, { io: 'output', unrepresentable: 'any', target: 'openapi-3.0' });

const errorResponse = {
	description: 'An error: `{error: {code, message, …}}`',
	content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } }
};

export function openApiDocument(origin: string) {
	const paths: Record<string, Record<string, unknown>> = {};
	for (const [path, methods] of Object.entries(operations)) {
		const item: Record<string, unknown> = {};
		const parameters = [...path.matchAll(/\{(\w+)\}/g)].map(([, name]) => ({
			name,
			in: 'path',
			required: true,
			schema: { type: 'string' }
		}));
		for (const [method, op] of Object.entries(methods)) {
			const query = op.query
				? Object.keys(op.query.shape).map((name) => ({
						name,
						in: 'query',
						schema: { type: 'string' }
					}))
				: [];
			item[method] = {
				summary: op.summary,
				...(op.description && { description: op.description }),
				security: op.public ? [] : [{ session: [] }, { bearer: [] }],
				parameters: [...parameters, ...query],
				...(op.body && {
					requestBody: {
						required: true,
						content: { 'application/json': { schema: jsonSchema(op.body) } }
					}
				}),
				...(op.csv && {
					requestBody: {
						required: true,
						content: {
							'text/csv': { schema: { type: 'string' } },
							'multipart/form-data': {
								schema: {
									type: 'object',
									required: ['file'],
									properties: { file: { type: 'string', format: 'binary' } }
								}
							}
						}
					}
				}),
				...(op.multipart && {
					requestBody: {
						required: true,
						content: {
							'multipart/form-data': {
								schema: {
									type: 'object',
									required: ['file'],
									properties: {
										file: { type: 'string', format: 'binary' },
										reason: { type: 'string' },
										letter: { type: 'string' }
									}
								}
							}
						}
					}
				}),
				responses: {
					[op.success]: {
						description: 'Success',
						...(op.success !== 204 && {
							content: {
								[op.produces ?? 'application/json']: op.response
									? { schema: responseSchema(op.response) }
									: {}
							}
						})
					},
					default: errorResponse
				}
			};
		}
		paths[path] = item;
	}
	return {
		openapi: '3.0.3',
		info: {
			title: 'Checkplate API',
			version: '1',
			description:
				'Drawings, revisions, features, fits and findings of a team, and the tolerance calculator. Results are advisory: the governing standard, the organisation\u2019s drawing practice and a qualified checker decide.'
		},
		servers: [{ url: `${origin}/api/v1` }],
		paths,
		components: {
			securitySchemes: {
				session: { type: 'apiKey', in: 'cookie', name: 'authjs.session-token' },
				bearer: { type: 'http', scheme: 'bearer', description: 'A personal API token' }
			},
			schemas: {
				Error: {
					type: 'object',
					required: ['error'],
					properties: {
						error: {
							type: 'object',
							required: ['code', 'message'],
							properties: {
								code: {
									type: 'string',
									description: Object.entries(errorCodes)
										.map(([status, codes]) => `${status}: ${codes.join(', ')}`)
										.join('; ')
								},
								message: { type: 'string' },
								position: { type: 'integer', description: 'For a bad callout' },
								current: { type: 'object', description: 'For 409 stale' }
							}
						}
					}
				}
			}
		}
	};
}
