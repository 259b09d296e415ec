import { insertMention, matchingPeople, mentionCandidates, mentionQueryAt } from './mentions';

const people = mentionCandidates([
  { userId: 2, displayName: 'Tomas Lindqvist', email: 'tomas.lindqvist@halvorsen.example', role: 'member' },
  { userId: 4, displayName: 'Tove Aalto', email: 'tove@halvorsen.example', role: 'viewer' },
  { userId: 1, displayName: 'Amara Okafor', email: 'amara.okafor@halvorsen.example', role: 'lead' },
]);

describe('mentions while typing', () => {
  it('finds the handle being typed before the caret, and none inside an e-mail address', () => {
    expect(mentionQueryAt('see @To', 7)).toEqual({ start: 4, text: 'to' });
    expect(mentionQueryAt('@', 1)).toEqual({ start: 0, text: '' });
    expect(mentionQueryAt('mail a@b', 8)).toBeNull();
    expect(mentionQueryAt('see @to now', 11)).toBeNull();
  });

  it('offers the members whose handle starts with the letters', () => {
    expect(matchingPeople(people, 'to').map((p) => p.handle)).toEqual(['tomas.lindqvist', 'tove']);
    expect(matchingPeople(people, 'am').map((p) => p.displayName)).toEqual(['Amara Okafor']);
    expect(matchingPeople(people, 'x')).toEqual([]);
  });

  it('replaces the typed letters with the whole handle and a space', () => {
    expect(insertMention('ask @to about it', 7, { start: 4, text: 'to' }, 'tove')).toEqual({ value: 'ask @tove about it', caret: 10 });
    expect(insertMention('@am', 3, { start: 0, text: 'am' }, 'amara.okafor')).toEqual({ value: '@amara.okafor ', caret: 14 });
  });
});
