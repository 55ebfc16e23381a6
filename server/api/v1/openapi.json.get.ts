import { z } from 'zod'
import { designInputSchema, stressInputSchema } from '#shared/schemas/stress'

// The machine-readable description of /api/v1, generated from the same zod schemas the routes use.
export default defineEventHandler(() => {
  const schema = (s: z.ZodType) => z.toJSONSchema(s, { target: 'openapi-3.0', io: 'input', unrepresentable: 'any' })
  const errorResponse = { description: 'Bad input: `message` and `data.issues[]` name each field', content: { 'application/json': { schema: { type: 'object' } } } }
  const operation = (summary: string, ref: string) => ({
    summary,
    security: [{ bearer: [] }, { session: [] }],
    parameters: [{
      name: 'provenance', in: 'query', required: false, schema: { type: 'string', enum: ['compact', 'full'], default: 'compact' },
      description: '`compact`: each row has a short `provenanceId`; the texts come once in the answer\'s `provenance: { [id]: { method, source } }`. `full`: every row carries `provenance: { method, source }`.',
    }],
    requestBody: { required: true, content: { 'application/json': { schema: { $ref: `#/components/schemas/${ref}` } } } },
    responses: { 200: { description: 'Stresses per device position and capacitor; see README' }, 400: errorResponse, 401: { description: 'No valid token or session' }, 422: errorResponse },
  })
  return {
    openapi: '3.0.3',
    info: { title: 'Stratavolt API', version: '1', description: 'Converter device and capacitor ratings. JSON, SI units (V, A, Hz, H, F).' },
    paths: {
      '/api/v1/stress': { post: operation('Evaluate one operating point (nothing saved)', 'StressInput') },
      '/api/v1/evaluate': { post: operation('Evaluate several operating points, derating and back-to-back (nothing saved)', 'DesignInput') },
    },
    components: {
      securitySchemes: {
        bearer: { type: 'http', scheme: 'bearer', description: 'Personal API token from "Your settings"' },
        session: { type: 'apiKey', in: 'cookie', name: 'nuxt-session' },
      },
      schemas: { StressInput: schema(stressInputSchema), DesignInput: schema(designInputSchema) },
    },
  }
})
