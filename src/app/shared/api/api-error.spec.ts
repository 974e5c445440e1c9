import { HttpErrorResponse } from '@angular/common/http';

import { apiError } from '../../testing/account-fixtures';
import { parseErrorBody, toApiProblem } from './api-error';

function httpError(status: number, error: unknown): HttpErrorResponse {
  return new HttpErrorResponse({ status, error, url: '/api/x' });
}

describe('toApiProblem', () => {
  it('API body with fields → its code, message and one message per field path', () => {
    const err = httpError(
      400,
      apiError('validation_failed', 'Some fields are wrong', [
        { path: 'email', message: 'Not an e-mail address' },
        { path: 'email', message: 'second message ignored' },
        { path: 'password', message: 'Too short' },
      ]),
    );
    expect(toApiProblem(err)).toEqual({
      status: 400,
      code: 'validation_failed',
      message: 'Some fields are wrong',
      fields: { email: 'Not an e-mail address', password: 'Too short' },
    });
  });

  it('status 0 → network problem with a sentence about the connection', () => {
    const problem = toApiProblem(httpError(0, new ProgressEvent('error')));
    expect(problem.code).toBe('network');
    expect(problem.message).toMatch(/cannot be reached/);
  });

  it('429 with an HTML body → generic "too many attempts", never the raw body', () => {
    const problem = toApiProblem(httpError(429, '<html>Too Many</html>'));
    expect(problem).toMatchObject({ status: 429, code: 'unexpected' });
    expect(problem.message).toMatch(/Too many attempts/);
    expect(problem.message).not.toContain('<html>');
  });

  it('a thrown Error (not HTTP) → "Something went wrong."', () => {
    expect(toApiProblem(new Error('boom')).message).toBe('Something went wrong.');
  });
});

describe('parseErrorBody', () => {
  it('fields of the wrong shape → dropped, the rest kept', () => {
    expect(
      parseErrorBody({ error: { code: 'x', message: 'y', fields: [{ path: 1 }, null] } }),
    ).toEqual({ error: { code: 'x', message: 'y', fields: [] } });
  });

  it('no code or message → null', () => {
    expect(parseErrorBody({ error: { message: 'y' } })).toBeNull();
    expect(parseErrorBody('text')).toBeNull();
  });
});
