import { applyProblem } from './server-errors';

describe('applyProblem', () => {
  it('when the server names known fields, then the messages go to those fields and no banner is set', () => {
    const setErrors = jest.fn();
    const setStatus = jest.fn();
    applyProblem(
      { kind: 'validation', code: 'VALIDATION_FAILED', message: 'Use a longer password.', fieldErrors: { password: 'This password is too common' } },
      { setErrors, setStatus },
      ['email', 'password'],
    );
    expect(setErrors).toHaveBeenCalledWith({ password: 'This password is too common' });
    expect(setStatus).toHaveBeenCalledWith(undefined);
  });

  it('when the problem is not about a field, then it becomes the form status message', () => {
    const setErrors = jest.fn();
    const setStatus = jest.fn();
    applyProblem({ kind: 'rate-limited', code: 'RATE_LIMITED', message: '', retryAfterSeconds: null }, { setErrors, setStatus }, ['email']);
    expect(setErrors).not.toHaveBeenCalled();
    expect(setStatus).toHaveBeenCalledWith({ error: expect.stringMatching(/Too many attempts/) });
  });
});
