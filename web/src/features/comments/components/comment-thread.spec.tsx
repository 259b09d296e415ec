import type { CommentDto, CurrentUser, GroupMember } from '@sixtyfold/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { adminUser, memberUser } from '@/testing/fixtures';
import { json, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render';
import { CommentThread } from './comment-thread';

const members: GroupMember[] = [
  { userId: 1, displayName: 'Amara Okafor', email: 'amara.okafor@halvorsen.example', role: 'lead' },
  { userId: 2, displayName: 'Tomas Lindqvist', email: 'tomas.lindqvist@halvorsen.example', role: 'member' },
  { userId: 4, displayName: 'Tove Aalto', email: 'tove@halvorsen.example', role: 'viewer' },
];
const person = (m: GroupMember) => ({ id: m.userId, displayName: m.displayName, handle: m.email.split('@')[0] });

function comment(overrides: Partial<CommentDto> = {}): CommentDto {
  return {
    id: 900,
    scanId: 42,
    pointIndex: null,
    body: 'The plateau edge looks under-resolved.',
    author: person(members[0]),
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:00.000Z',
    edited: false,
    mentions: [],
    ...overrides,
  };
}

/** A thread the mock API stores: POST appends, PATCH edits, DELETE removes, GET lists. */
function threadApi(initial: CommentDto[], author: CurrentUser = memberUser) {
  let stored = [...initial];
  let nextId = 1000;
  return mockApi({
    'GET /api/scans/42/comments': () => json(200, stored),
    'POST /api/scans/42/comments': (request: MockRequest) => {
      const body = request.body as { body: string; pointIndex: number | null };
      const created = comment({ id: nextId++, body: body.body, pointIndex: body.pointIndex, author: { id: author.id, displayName: author.displayName, handle: author.email.split('@')[0] } });
      stored = [...stored, created];
      return json(201, created);
    },
    'PATCH /api/comments/901': (request: MockRequest) => {
      const body = (request.body as { body: string }).body;
      stored = stored.map((c) => (c.id === 901 ? { ...c, body, edited: true, updatedAt: '2026-12-01T11:00:00.000Z' } : c));
      return json(200, stored.find((c) => c.id === 901));
    },
    'DELETE /api/comments/900': () => {
      stored = stored.filter((c) => c.id !== 900);
      return new Response(null, { status: 204 });
    },
  });
}

const renderThread = (user: CurrentUser, pointIndex: number | null = null) =>
  renderWithProviders(<CommentThread scanId={42} groupId={10} pointIndex={pointIndex} user={user} members={members} />);

describe('CommentThread', () => {
  it('shows markup typed into a comment as text and never as an element', async () => {
    const { requests } = threadApi([]);
    const { user } = renderThread(memberUser);
    const attack = '<img src=x onerror=alert(1)>';

    await user.click(await screen.findByRole('textbox', { name: 'Add a comment' }));
    await user.paste(attack);
    await user.click(screen.getByRole('button', { name: 'Post comment' }));

    const posted = await screen.findByRole('article', { name: 'Comment by Tomas Lindqvist' });
    expect(within(posted).getByText(attack)).toBeInTheDocument();
    expect(document.querySelector('img')).toBeNull();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ body: attack, pointIndex: null });
  });

  it("posts to the point's own thread, keeps line breaks, and empties the box", async () => {
    const { requests } = threadApi([]);
    const { user } = renderThread(memberUser, 5);

    expect(await screen.findByText(/No comments yet on this point/)).toBeInTheDocument();
    const box = screen.getByRole('textbox', { name: 'Add a comment' });
    await user.type(box, 'First line{Shift>}{Enter}{/Shift}second line');
    await user.click(screen.getByRole('button', { name: 'Post comment' }));

    const posted = await screen.findByRole('article', { name: 'Comment by Tomas Lindqvist' });
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ body: 'First line\nsecond line', pointIndex: 5 });
    expect(requests.filter((r) => r.method === 'GET').every((r) => r.url.searchParams.get('pointIndex') === '5')).toBe(true);
    expect(within(posted).getByText(/First line/).textContent).toBe('First line\nsecond line');
    expect(within(posted).getByText(/First line/)).toHaveStyle({ whiteSpace: 'pre-wrap' });
    await waitFor(() => expect(box).toHaveValue(''));
    expect(screen.getByText('1 comment')).toBeInTheDocument();
  });

  it('refuses an empty comment with the shared schema before calling the API', async () => {
    const { requests } = threadApi([]);
    const { user } = renderThread(memberUser);
    await user.type(await screen.findByRole('textbox', { name: 'Add a comment' }), '   ');
    await user.click(screen.getByRole('button', { name: 'Post comment' }));
    expect(await screen.findByText('Write something first')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('lets the author edit their own comment and marks it edited', async () => {
    const mine = comment({ id: 901, author: person(members[1]), body: 'n_s drifts low here' });
    const { requests } = threadApi([comment(), mine]);
    const { user } = renderThread(memberUser);

    const article = await screen.findByRole('article', { name: 'Comment by Tomas Lindqvist' });
    await user.click(within(article).getByRole('button', { name: 'Edit comment' }));
    const box = within(article).getByRole('textbox', { name: 'Edit your comment' });
    expect(box).toHaveValue('n_s drifts low here');
    await user.clear(box);
    await user.type(box, 'n_s drifts low at small f');
    await user.click(within(article).getByRole('button', { name: 'Save' }));

    expect(await within(article).findByText('n_s drifts low at small f')).toBeInTheDocument();
    expect(within(article).getByText('edited')).toBeInTheDocument();
    expect(requests.filter((r) => r.method === 'PATCH').map((r) => [r.url.pathname, r.body])).toEqual([['/api/comments/901', { body: 'n_s drifts low at small f' }]]);
  });

  it("offers neither edit nor delete on someone else's comment to a member", async () => {
    threadApi([comment()]);
    renderThread(memberUser);
    const article = await screen.findByRole('article', { name: 'Comment by Amara Okafor' });
    expect(within(article).queryByRole('button', { name: 'Edit comment' })).not.toBeInTheDocument();
    expect(within(article).queryByRole('button', { name: 'Delete comment' })).not.toBeInTheDocument();
  });

  it("lets a site admin delete another's comment after confirming, without editing it", async () => {
    const theirs = comment({ author: person(members[1]) });
    const { requests } = threadApi([theirs]);
    const { user } = renderThread({ ...adminUser, id: 1 });

    const article = await screen.findByRole('article', { name: 'Comment by Tomas Lindqvist' });
    expect(within(article).queryByRole('button', { name: 'Edit comment' })).not.toBeInTheDocument();
    await user.click(within(article).getByRole('button', { name: 'Delete comment' }));
    const dialog = await screen.findByRole('alertdialog');
    expect(dialog).toHaveTextContent('Tomas Lindqvist’s comment disappears');
    await user.click(within(dialog).getByRole('button', { name: 'Delete comment' }));

    await waitFor(() => expect(screen.queryByRole('article')).not.toBeInTheDocument());
    expect(requests.filter((r) => r.method === 'DELETE').map((r) => r.url.pathname)).toEqual(['/api/comments/900']);
  });

  it('highlights resolved mentions as text', async () => {
    threadApi([comment({ body: 'Ask @tomas.lindqvist, not @nobody.', mentions: [person(members[1])] })]);
    renderThread(memberUser);
    const article = await screen.findByRole('article', { name: 'Comment by Amara Okafor' });
    const marks = article.querySelectorAll('mark');
    expect([...marks].map((m) => m.textContent)).toEqual(['@tomas.lindqvist']);
    expect(marks[0]).toHaveAttribute('title', 'Tomas Lindqvist');
    expect(within(article).getByText(/not @nobody\./)).toBeInTheDocument();
  });

  it('completes a handle from the group: arrows choose, Enter inserts, Escape closes', async () => {
    threadApi([]);
    const { user } = renderThread(memberUser);
    const box = await screen.findByRole('textbox', { name: 'Add a comment' });

    await user.type(box, 'Thanks @to');
    const list = screen.getByRole('listbox', { name: 'People to mention' });
    expect(within(list).getAllByRole('option').map((o) => o.textContent)).toEqual(['Tomas Lindqvist @tomas.lindqvist', 'Tove Aalto @tove']);
    expect(box).toHaveAttribute('aria-activedescendant', within(list).getAllByRole('option')[0].id);
    await user.keyboard('{ArrowDown}');
    expect(within(list).getByRole('option', { name: /Tove Aalto/ })).toHaveAttribute('aria-selected', 'true');
    await user.keyboard('{Enter}');
    expect(box).toHaveValue('Thanks @tove ');
    expect(screen.queryByRole('listbox')).not.toBeInTheDocument();

    await user.type(box, 'and @a');
    expect(screen.getByRole('option', { name: /Amara Okafor/ })).toBeInTheDocument();
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('listbox')).not.toBeInTheDocument();
    expect(box).toHaveValue('Thanks @tove and @a');

    await user.type(box, 'm');
    await user.click(screen.getByRole('option', { name: /Amara Okafor/ }));
    expect(box).toHaveValue('Thanks @tove and @amara.okafor ');
  });
});
