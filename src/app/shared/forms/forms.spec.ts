import { FormControl, FormGroup, Validators } from '@angular/forms';

import { differsFromSibling, fieldMessage, matchesSibling } from './field-message';
import { applyServerErrors } from './server-errors';

describe('fieldMessage', () => {
  it('required → "<label> is required."', () => {
    const c = new FormControl('', Validators.required);
    expect(fieldMessage(c, 'E-mail')).toBe('E-mail is required.');
  });

  it('bad e-mail → message naming the field and showing the expected form', () => {
    const c = new FormControl('not-an-address', Validators.email);
    expect(fieldMessage(c, 'E-mail')).toBe(
      'E-mail must be an e-mail address like name@example.com.',
    );
  });

  it('too short → message with the required length', () => {
    const c = new FormControl('abc', Validators.minLength(10));
    expect(fieldMessage(c, 'Password')).toBe('Password needs at least 10 characters.');
  });

  it('server error beside a local one → the server message wins', () => {
    const c = new FormControl('');
    c.setErrors({ required: true, server: 'This address already has an account' });
    expect(fieldMessage(c, 'E-mail')).toBe('This address already has an account');
  });

  it('valid control → empty string', () => {
    expect(fieldMessage(new FormControl('x'), 'Name')).toBe('');
  });
});

describe('matchesSibling / differsFromSibling', () => {
  function group(a: string, b: string) {
    return new FormGroup({
      first: new FormControl(a),
      second: new FormControl(b, [matchesSibling('first')]),
      third: new FormControl(b, [differsFromSibling('first')]),
    });
  }

  it('different repeat → mismatch on the repeat control', () => {
    const g = group('secret-one-1', 'secret-two-2');
    g.controls.second.updateValueAndValidity();
    expect(g.controls.second.errors).toEqual({ mismatch: true });
  });

  it('equal repeat → valid; equal to current → sameAsCurrent', () => {
    const g = group('same-value-1', 'same-value-1');
    g.controls.second.updateValueAndValidity();
    g.controls.third.updateValueAndValidity();
    expect(g.controls.second.errors).toBeNull();
    expect(g.controls.third.errors).toEqual({ sameAsCurrent: true });
  });
});

describe('applyServerErrors', () => {
  const problem = (fields: Record<string, string>) => ({
    status: 409,
    code: 'conflict',
    message: 'This address already has an account',
    fields,
  });

  it('every field matched → errors on the controls, touched, no form-level message', () => {
    const form = new FormGroup({ email: new FormControl('a@b.c') });
    const rest = applyServerErrors(form, problem({ email: 'Already registered' }));
    expect(rest).toBeNull();
    expect(form.controls.email.errors).toEqual({ server: 'Already registered' });
    expect(form.controls.email.touched).toBe(true);
  });

  it('no fields → the message is for the form', () => {
    const form = new FormGroup({ email: new FormControl('a@b.c') });
    expect(applyServerErrors(form, problem({}))).toBe('This address already has an account');
  });

  it('a field with no control → the form-level message too', () => {
    const form = new FormGroup({ email: new FormControl('a@b.c') });
    expect(applyServerErrors(form, problem({ email: 'x', token: 'expired' }))).toBe(
      'This address already has an account',
    );
  });

  it('editing the field after a server error → the server error is gone', () => {
    const form = new FormGroup({ email: new FormControl('a@b.c', Validators.required) });
    applyServerErrors(form, problem({ email: 'Already registered' }));
    form.controls.email.setValue('other@b.c');
    expect(form.controls.email.errors).toBeNull();
  });
});
