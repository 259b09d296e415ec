import { configure, screen, waitFor, within } from '@testing-library/react';
import { memberUser } from '@/testing/fixtures';
import { apiError, json, mockApi } from '@/testing/mock-api';
import { renderApp } from '@/testing/render';
import { logModel } from '../model-fixtures';

// The models page typesets the built-in families, which happy-dom takes seconds to lay out.
configure({ asyncUtilTimeout: 10_000 });
vi.setConfig({ testTimeout: 30_000 });

const modelFile = () =>
  new File([JSON.stringify({ format: 'sixtyfold.potential', version: 1, name: logModel.name })], 'log.potential.json', { type: 'application/json' });

describe('model files', () => {
  it('imports a file into the chosen group, shows a refusal with its line, and opens the new model', async () => {
    let answer = apiError(400, 'line 4: the file is not valid JSON: comma expected here');
    const { requests } = mockApi({
      'GET /api/auth/me': () => json(200, memberUser),
      'GET /api/models': () => json(200, []),
      'GET /api/models/7': () => json(200, logModel),
      'POST /api/models/import': () => answer,
    });
    const { user, router } = renderApp('/models');

    await user.click(await screen.findByRole('button', { name: 'Import file' }));
    const dialog = await screen.findByRole('dialog', { name: 'Import a model file' });
    const importButton = within(dialog).getByRole('button', { name: 'Import' });
    expect(importButton).toBeDisabled();
    await user.upload(within(dialog).getByLabelText(/Model file/), modelFile());
    await user.click(importButton);

    expect(await within(dialog).findByRole('alert')).toHaveTextContent('line 4: the file is not valid JSON: comma expected here');
    const sent = requests.find((r) => r.method === 'POST')!;
    expect(sent.headers.get('X-Sixtyfold-Request')).toBe('upload');
    const form = sent.body as FormData;
    expect(form.get('groupId')).toBe('10');
    expect((form.get('file') as File).name).toBe('log.potential.json');
    expect(router.state.location.pathname).toBe('/models');

    answer = json(201, logModel);
    await user.click(importButton);
    await waitFor(() => expect(router.state.location.pathname).toBe('/models/7'));
  });

  it('offers the model as a file to download on its page', async () => {
    mockApi({ 'GET /api/auth/me': () => json(200, memberUser), 'GET /api/models/7': () => json(200, logModel) });
    renderApp('/models/7');

    expect(await screen.findByRole('link', { name: 'Export file' })).toHaveAttribute('href', '/api/models/7/export');
  });
});
