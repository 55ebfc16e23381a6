// Issue 14: messages in the user's words with the machine path kept, and the session answer that follows
// the database (role change, disabling) without signing in again.
import { describe, expect, it } from 'vitest'
import { client, linkIn, signIn, signInAs, unique, waitForMail } from '../support/api'

const design = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 100,
    operatingPoints: [{ name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 400, powerFactor: 0.86, fundamentalHz: 50 }],
  },
}

describe('validation messages', () => {
  it('a preview with a power factor above 1: the label and what to do in the message, the machine path in data.issues', async () => {
    const api = await signInAs('design-engineer')
    const body = structuredClone(design)
    body.machineSide.operatingPoints[0]!.powerFactor = 1.2
    const r = await api.json('POST', '/api/designs/preview', body)
    expect(r.status).toBe(422)
    expect(r.body.message).toBe('Operating point 1: Power factor must be at most 1: enter that or less.')
    expect(r.body.data.issues).toEqual([{ path: 'machineSide.operatingPoints.0.powerFactor', message: 'Power factor must be at most 1: enter that or less.' }])
  })

  it('an engine refusal (worst-case DC link below nominal) names both fields by their labels', async () => {
    const api = await signInAs('design-engineer')
    const r = await api.json('POST', '/api/designs/preview', { ...design, machineSide: { ...design.machineSide, dcVoltageMax: 900 } })
    expect(r.status).toBe(422)
    expect(r.body.data.issues[0].path).toBe('machineSide.dcVoltageMax')
    expect(r.body.message).toContain('DC link, worst case')
    expect(r.body.message).not.toMatch(/dcVoltage|Invalid field/)
  })
})

describe('the session answer follows the database', () => {
  it('shows a role change at once and ends with "disabled" when the account is disabled', async () => {
    const admin = await signInAs('admin')
    const email = `${unique('live')}@example.com`
    const invited = await admin.json('POST', '/api/admin/users', { email, name: 'Lena Live', role: 'viewer' })
    expect(invited.status).toBe(201)
    const mail = await waitForMail(email, 'invited')
    const token = new URL(linkIn(mail.text)).searchParams.get('token')!
    expect((await client().json('POST', '/api/auth/set-password', { token, password: 'live-password-123' })).status).toBe(200)
    const person = await signIn(email, 'live-password-123')
    expect((await person.json('GET', '/api/_auth/session')).body.user.role).toBe('viewer')

    expect((await admin.json('PATCH', `/api/admin/users/${invited.body.id}`, { role: 'purchasing' })).status).toBe(200)
    const after = await person.json('GET', '/api/_auth/session')
    expect(after.body.user).toMatchObject({ email, name: 'Lena Live', role: 'purchasing' })

    expect((await admin.json('PATCH', `/api/admin/users/${invited.body.id}`, { disabled: true })).status).toBe(200)
    const ended = await person.json('GET', '/api/_auth/session')
    expect(ended.status).toBe(200)
    expect(ended.body).toEqual({ ended: 'disabled' })
    expect((await person.json('GET', '/api/designs')).status).toBe(401)
  })
})
