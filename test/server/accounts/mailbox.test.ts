import { linksIn, plainTextBody } from '../../../server/mail/mail-body';
import { ApiClient, mailTo } from '../../utils/api-client';
import { startTestServer, type TestServer } from '../../utils/test-server';
import { TEST_PASSWORD, uniqueEmail } from './team-fixture';

// Each file starts a real server with a fresh database; on a shared 2-core machine that can
// take longer than jest's 5 s default.
jest.setTimeout(30_000);

describe('plainTextBody(raw)', () => {
  test('quoted-printable with a soft line break and =XX escapes → decoded text', () => {
    // RFC 2045 §6.7: "=" + CRLF is a soft line break; "=3D" is "=", "=C3=A9" is UTF-8 "é".
    const raw =
      'Subject: x\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\n' +
      'a=3Db caf=C3=A9 http://127.0.0.1:4300/invitations/abc=\r\ndef\r\n';
    expect(plainTextBody(raw)).toBe('a=b café http://127.0.0.1:4300/invitations/abcdef\n');
  });

  test('base64 body → decoded text; 7bit body → as is', () => {
    const b64 = Buffer.from('Motor-drive team', 'utf8').toString('base64');
    expect(plainTextBody(`Content-Transfer-Encoding: base64\r\n\r\n${b64}\r\n`)).toBe(
      'Motor-drive team',
    );
    expect(plainTextBody('Subject: y\r\n\r\nplain\r\nlines')).toBe('plain\nlines');
  });

  test('linksIn → every http(s) link, in order', () => {
    expect(linksIn('see https://a.test/x and http://b.test/y.')).toEqual([
      'https://a.test/x',
      'http://b.test/y.',
    ]);
  });
});

describe('/dev/mailbox (development and tests only)', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.stop();
  });

  test('a sent invitation → listed in /dev/mailbox.json with decoded text and its link', async () => {
    const owner = new ApiClient(server.url);
    await owner.register(uniqueEmail('owner'), TEST_PASSWORD, '<b>Owner</b>');
    const teamId = (await owner.post<{ id: string }>('/api/teams', { name: 'Mail team' })).body.id;
    const invitee = uniqueEmail('invitee');
    await owner.post(`/api/teams/${teamId}/invitations`, { email: invitee, role: 'viewer' });
    const [mail] = await mailTo(server.url, invitee);
    expect(mail?.text).toContain('"Mail team" on Rampart as viewer');
    expect(mail?.links[0]).toMatch(new RegExp(`^${server.url}/invitations/[A-Za-z0-9_-]{43}$`));

    const html = await (await fetch(`${server.url}/dev/mailbox`)).text();
    expect(html).toContain(`<a href="${mail?.links[0]}">`);
    // Mail content is escaped: a name with markup shows as text.
    expect(html).toContain('&lt;b&gt;Owner&lt;/b&gt;');
    expect(html).not.toContain('<b>Owner</b>');
  });
});

describe('/dev/mailbox under NODE_ENV=production', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-production-like-secret-for-tests',
    });
  });
  afterAll(async () => {
    await server.stop();
  });

  test('no fake SMTP server and no mailbox routes', async () => {
    expect(server.mailbox).toBeUndefined();
    const res = await fetch(`${server.url}/dev/mailbox.json`);
    expect(res.headers.get('content-type') ?? '').not.toMatch(/json/);
    expect(await res.text()).not.toMatch(/Mailbox|"subject"/);
  });
});
