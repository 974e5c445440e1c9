import type { InvitationPreview, TeamDto } from '@rampart/collab/api/accounts';
import { hashLinkToken } from '../../../server/domain/secrets';
import { ApiClient, mailTo } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { inviteAndGetToken, TEST_PASSWORD, uniqueEmail } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('invitations by e-mail', () => {
  let server: TestServer;
  let owner: ApiClient;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer({ PUBLIC_ORIGIN: 'https://rampart.example.test' });
    owner = new ApiClient(server.url);
    await owner.register(uniqueEmail('owner'), TEST_PASSWORD, 'Olga Owner');
    teamId = (await owner.post<{ id: string }>('/api/teams', { name: 'Gate-driver team' })).body.id;
  });
  afterAll(async () => {
    await server.stop();
  });

  test('invite → mail through the fake SMTP with a PUBLIC_ORIGIN/invitations/<token> link', async () => {
    const email = uniqueEmail('Invitee').toUpperCase();
    const res = await owner.post<{ email: string; role: string }>(
      `/api/teams/${teamId}/invitations`,
      {
        email,
        role: 'reviewer',
      },
    );
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: email.toLowerCase(), role: 'reviewer' });
    const [mail] = await mailTo(server.url, email);
    expect(mail?.subject).toBe('Olga Owner invited you to Gate-driver team on Rampart');
    expect(mail?.links).toHaveLength(1);
    expect(mail?.links[0]).toMatch(
      /^https:\/\/rampart\.example\.test\/invitations\/[A-Za-z0-9_-]{43}$/,
    );
  });

  test('the token is stored only as its SHA-256', async () => {
    const email = uniqueEmail('hashed');
    const { token } = await inviteAndGetToken(owner, teamId, email, 'viewer');
    const rows: Array<{ token_hash: string }> = await server.dataSource.query(
      'SELECT token_hash FROM invitations WHERE email = $1',
      [email],
    );
    expect(rows[0]?.token_hash).toBe(hashLinkToken(token));
    expect(rows[0]?.token_hash).not.toContain(token);
  });

  test('preview → team, role, inviter; accept as the invited address → 200 and member', async () => {
    const email = uniqueEmail('joiner');
    const { token } = await inviteAndGetToken(owner, teamId, email, 'editor');
    const joiner = new ApiClient(server.url);
    const preview = await joiner.get<InvitationPreview>(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({
      teamName: 'Gate-driver team',
      email,
      role: 'editor',
      invitedBy: 'Olga Owner',
    });
    expect((await joiner.post(`/api/invitations/${token}/accept`)).status).toBe(401);
    await joiner.register(email, TEST_PASSWORD, 'Joiner');
    const accepted = await joiner.post<TeamDto>(`/api/invitations/${token}/accept`);
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ id: teamId, name: 'Gate-driver team', role: 'editor' });
    expect((await joiner.me()).body.memberships).toEqual([
      { teamId, teamName: 'Gate-driver team', role: 'editor' },
    ]);
  });

  test('accept the same link twice → 409 "already been used"; still one membership', async () => {
    const email = uniqueEmail('twice');
    const { token } = await inviteAndGetToken(owner, teamId, email, 'viewer');
    const c = new ApiClient(server.url);
    await c.register(email, TEST_PASSWORD);
    expect((await c.post(`/api/invitations/${token}/accept`)).status).toBe(200);
    const again = await c.post(`/api/invitations/${token}/accept`);
    expect(again.status).toBe(409);
    expect(again.body).toMatchObject({
      error: { message: 'This invitation has already been used' },
    });
    expect((await c.get(`/api/invitations/${token}`)).status).toBe(409);
  });

  test('accept while signed in as another address → 403 naming both addresses, not joined', async () => {
    const invited = uniqueEmail('invited');
    const { token } = await inviteAndGetToken(owner, teamId, invited, 'editor');
    const someoneElse = new ApiClient(server.url);
    const other = uniqueEmail('other');
    await someoneElse.register(other, TEST_PASSWORD);
    const res = await someoneElse.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(403);
    expect(res.body).toEqual({
      error: {
        code: 'forbidden',
        message:
          `This invitation was sent to ${invited}, but you are signed in as ${other}. ` +
          `Sign out and sign in (or register) as ${invited} to accept it.`,
      },
    });
    expect((await someoneElse.me()).body.memberships).toEqual([]);
    // The refusal did not use the link up: the right person can still accept.
    const right = new ApiClient(server.url);
    await right.register(invited, TEST_PASSWORD);
    expect((await right.post(`/api/invitations/${token}/accept`)).status).toBe(200);
  });

  test('an expired invitation → 409 saying it expired; not joined', async () => {
    const email = uniqueEmail('late');
    const { token } = await inviteAndGetToken(owner, teamId, email, 'viewer');
    await server.dataSource.query(
      `UPDATE invitations SET expires_at = now() - interval '1 minute' WHERE email = $1`,
      [email],
    );
    const c = new ApiClient(server.url);
    await c.register(email, TEST_PASSWORD);
    const res = await c.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({
      error: { message: expect.stringMatching(/^This invitation expired on /) },
    });
    expect((await c.me()).body.memberships).toEqual([]);
  });

  test('default expiry → INVITATION_TTL_HOURS (168 h) after sending', async () => {
    const email = uniqueEmail('ttl');
    const before = Date.now();
    const res = await owner.post<{ expiresAt: string }>(`/api/teams/${teamId}/invitations`, {
      email,
      role: 'viewer',
    });
    const hours = (Date.parse(res.body.expiresAt) - before) / 3_600_000;
    expect(hours).toBeGreaterThan(167.99);
    expect(hours).toBeLessThan(168.01);
  });

  test('withdrawn invitation → 404 on preview and accept; listed no more', async () => {
    const email = uniqueEmail('withdrawn');
    const { token, invitationId } = await inviteAndGetToken(owner, teamId, email, 'viewer');
    expect((await owner.delete(`/api/teams/${teamId}/invitations/${invitationId}`)).status).toBe(
      204,
    );
    expect((await owner.get(`/api/invitations/${token}`)).status).toBe(404);
    const list = await owner.get<Array<{ id: string }>>(`/api/teams/${teamId}/invitations`);
    expect(list.body.map((i) => i.id)).not.toContain(invitationId);
  });

  test('inviting someone who is already a member → 409 naming the email field', async () => {
    const email = uniqueEmail('member');
    const { token } = await inviteAndGetToken(owner, teamId, email, 'viewer');
    const c = new ApiClient(server.url);
    await c.register(email, TEST_PASSWORD);
    await c.post(`/api/invitations/${token}/accept`);
    const res = await owner.post(`/api/teams/${teamId}/invitations`, { email, role: 'editor' });
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({ error: { fields: [{ path: 'email' }] } });
  });

  test('an unknown or malformed token → 404', async () => {
    const c = new ApiClient(server.url);
    expect((await c.get(`/api/invitations/${'A'.repeat(43)}`)).status).toBe(404);
    expect((await c.get('/api/invitations/short')).status).toBe(404);
  });
});
