import type { APIRoute } from 'astro';
import { openApiAnswer } from '../../server/api/openapi-answer.server';

/** GET /api/openapi.json — anyone: the API as OpenAPI 3.1, generated from the endpoints' own zod schemas. */
export const GET: APIRoute = ({ request }) => openApiAnswer(request);
