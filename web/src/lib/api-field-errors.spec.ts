import { ApiRequestError } from './api-client';
import { showApiFieldErrors } from './api-field-errors';

describe('showApiFieldErrors', () => {
  it('places the first message of each named field and ignores the others', () => {
    const setError = vi.fn();
    const error = new ApiRequestError(400, 'Check the form', { name: ['give the region a name', 'second'], other: ['not a field of this form'] });

    expect(showApiFieldErrors<{ name: string; source: string }>(error, ['name', 'source'], setError)).toBe(true);
    expect(setError.mock.calls).toEqual([['name', { message: 'give the region a name' }]]);
  });

  it('places nothing for an error without field messages', () => {
    const setError = vi.fn();
    expect(showApiFieldErrors(new ApiRequestError(413, 'The file is too large'), ['name'], setError)).toBe(false);
    expect(showApiFieldErrors(new Error('network'), ['name'], setError)).toBe(false);
    expect(setError).not.toHaveBeenCalled();
  });
});
