import { navItem, navItemsFor } from './navigation';

describe('navItemsFor', () => {
  it('gives an admin the shared pages, the planner, the users and workers pages, but not the upload', () => {
    expect(navItemsFor(['admin']).map((item) => item.id)).toEqual(['overview', 'runs', 'planner', 'setups', 'profiles', 'audit', 'users', 'workers']);
  });

  it('gives an experimentalist the upload and the planner after it, and keeps the users page from them', () => {
    expect(navItemsFor(['experimentalist']).map((item) => item.id)).toEqual(['overview', 'runs', 'upload', 'planner', 'setups', 'profiles']);
  });

  it('gives an auditor the pages to read and the audit page, without upload, planner or users', () => {
    expect(navItemsFor(['auditor']).map((item) => item.id)).toEqual(['overview', 'runs', 'setups', 'profiles', 'audit']);
  });

  it('shows a page once to a user who holds several of its roles', () => {
    expect(navItemsFor(['auditor', 'shift-lead', 'admin']).map((item) => item.id)).toEqual(['overview', 'runs', 'planner', 'setups', 'profiles', 'audit', 'users', 'workers']);
  });

  it('shows nothing to a user without roles', () => {
    expect(navItemsFor([])).toEqual([]);
  });
});

describe('navItem', () => {
  it('finds an entry by its name', () => {
    expect(navItem('users')).toEqual(expect.objectContaining({ path: '/users', roles: ['admin'] }));
    expect(navItem('planner')).toEqual(expect.objectContaining({ path: '/planner', roles: ['experimentalist', 'shift-lead', 'admin'] }));
  });
});
