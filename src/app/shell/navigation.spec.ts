import { navItem, navItemsFor } from './navigation';

describe('navItemsFor', () => {
  it('gives an admin the overview and the users page', () => {
    expect(navItemsFor(['admin']).map((item) => item.id)).toEqual(['overview', 'users']);
  });

  it('keeps the users page from an experimentalist', () => {
    expect(navItemsFor(['experimentalist']).map((item) => item.id)).toEqual(['overview']);
  });

  it('shows a page once to a user who holds several of its roles', () => {
    expect(navItemsFor(['auditor', 'shift-lead', 'admin']).map((item) => item.id)).toEqual([
      'overview',
      'users',
    ]);
  });

  it('shows nothing to a user without roles', () => {
    expect(navItemsFor([])).toEqual([]);
  });
});

describe('navItem', () => {
  it('finds an entry by its name', () => {
    expect(navItem('users')).toEqual(expect.objectContaining({ path: '/users', roles: ['admin'] }));
  });
});
