import nodemailer from 'nodemailer';

import { FakeSmtpServer, headerValue } from '../../server/mail/fake-smtp';

describe('FakeSmtpServer', () => {
  test('a message sent with nodemailer → kept with envelope and subject', async () => {
    const smtp = new FakeSmtpServer();
    const port = await smtp.start(0);
    try {
      const transport = nodemailer.createTransport({
        host: '127.0.0.1',
        port,
        secure: false,
        ignoreTLS: true,
      });
      await transport.sendMail({
        from: 'rampart@localhost',
        to: 'lead@example.test',
        subject: 'Review requested: 3V3 enable delay',
        text: 'Please look at the margin.',
      });
      expect(smtp.messages).toHaveLength(1);
      expect(smtp.messages[0]).toMatchObject({
        from: 'rampart@localhost',
        to: ['lead@example.test'],
        subject: 'Review requested: 3V3 enable delay',
      });
      expect(smtp.messages[0]?.raw).toContain('Please look at the margin.');
    } finally {
      await smtp.stop();
    }
  });

  test('headerValue → unfolds continuation lines, is case-insensitive, empty when absent', () => {
    const raw = 'Subject: a long\r\n subject line\r\nX-Other: 1\r\n\r\nSubject: not a header';
    expect(headerValue(raw, 'subject')).toBe('a long subject line');
    expect(headerValue(raw, 'to')).toBe('');
  });
});
