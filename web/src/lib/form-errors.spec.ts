import { ApiRequestError } from './api-client';
import { applyFieldErrors, isFieldRefusal } from './form-errors';

describe('applyFieldErrors', () => {
  it("puts each field's first message on that field, by its path, and skips the body-wide `_`", () => {
    const setError = vi.fn();
    const refusal = new ApiRequestError(400, 'bad input', {
      email: ['give an e-mail address', 'second message'],
      'axes.0.min': ['min must be below max'],
      _: ['the body as a whole'],
    });
    applyFieldErrors(refusal, setError);
    expect(setError.mock.calls).toEqual([
      ['email', { type: 'server', message: 'give an e-mail address' }],
      ['axes.0.min', { type: 'server', message: 'min must be below max' }],
    ]);
  });

  it('leaves the form alone for anything but a 400 (those are shown above the form)', () => {
    const setError = vi.fn();
    applyFieldErrors(new ApiRequestError(409, 'taken', { name: ['taken'] }), setError);
    applyFieldErrors(new Error('network'), setError);
    expect(setError).not.toHaveBeenCalled();
    expect(isFieldRefusal(new ApiRequestError(400, 'bad'))).toBe(true);
    expect(isFieldRefusal(new ApiRequestError(502, 'mail refused'))).toBe(false);
  });
});
