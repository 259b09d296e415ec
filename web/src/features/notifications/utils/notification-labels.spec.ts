import { notificationTarget } from './notification-labels';

const withLink = (link: string | null) => ({ payload: { title: 'A scan finished', link } });

describe('notificationTarget', () => {
  it('follows paths inside the app', () => {
    expect(notificationTarget(withLink('/scans/12/points/4'))).toBe('/scans/12/points/4');
    expect(notificationTarget(withLink('/preferences'))).toBe('/preferences');
  });

  it('follows nothing else', () => {
    for (const link of [null, '', 'https://elsewhere.example/x', '//elsewhere.example', '/\\elsewhere.example', 'javascript:alert(1)']) {
      expect(notificationTarget(withLink(link))).toBeNull();
    }
  });
});
