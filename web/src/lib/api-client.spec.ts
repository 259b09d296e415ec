import { api, ApiRequestError } from './api-client';
import { apiError, json, mockApi } from '@/testing/mock-api';

describe('api client', () => {
  it('sends JSON with an empty object body on state-changing requests', async () => {
    const { requests } = mockApi({ 'POST /api/auth/logout': () => new Response(null, { status: 204 }) });

    await expect(api.post('/auth/logout')).resolves.toBeUndefined();

    expect(requests[0].headers.get('content-type')).toBe('application/json');
    expect(requests[0].body).toEqual({});
    expect(requests[0].credentials).toBe('same-origin');
  });

  it('leaves GET requests without a body and adds query parameters', async () => {
    const { fetchMock } = mockApi({ 'GET /api/scans': () => json(200, { items: [], total: 0, page: 2, pageSize: 5 }) });
    const { z } = await import('zod');

    await api.get('/scans', { query: { page: 2, pageSize: 5, action: undefined }, schema: z.unknown() });

    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/scans?page=2&pageSize=5');
    expect(init?.body).toBeUndefined();
  });

  it('turns an ApiError body into ApiRequestError with status and field errors', async () => {
    mockApi({ 'POST /api/auth/login': () => apiError(400, 'Check the form', { email: ['Enter an e-mail'] }) });

    const error = await api.post('/auth/login', { body: {} }).catch((e: unknown) => e);

    expect(error).toBeInstanceOf(ApiRequestError);
    expect(error).toMatchObject({ status: 400, message: 'Check the form', fieldErrors: { email: ['Enter an e-mail'] } });
  });

  it('keeps the line of a refused upload and sends the upload header', async () => {
    const { requests } = mockApi({ 'POST /api/constraint-regions': () => apiError(400, 'line 4: n_s must lie between 0 and 2 (found 3)', undefined, 4) });
    const form = new FormData();
    form.set('name', 'Survey A');

    const error = await api.upload('/constraint-regions', form).catch((e: unknown) => e);

    expect(error).toMatchObject({ status: 400, line: 4, message: 'line 4: n_s must lie between 0 and 2 (found 3)' });
    expect(requests[0].headers.get('x-sixtyfold-request')).toBe('upload');
    expect(requests[0].body).toBe(form);
  });

  it('reports an unreachable server as status 0', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('fetch failed')));

    await expect(api.post('/auth/logout')).rejects.toMatchObject({ status: 0, message: 'Could not reach the Sixtyfold server.' });
  });

  it('rejects a response whose shape does not match the schema', async () => {
    const { z } = await import('zod');
    mockApi({ 'GET /api/models': () => json(200, { unexpected: true }) });

    await expect(api.get('/models', { schema: z.array(z.object({ id: z.number() })) })).rejects.toBeInstanceOf(ApiRequestError);
  });
});
