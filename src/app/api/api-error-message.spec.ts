import { HttpErrorResponse } from '@angular/common/http';

import { apiErrorMessage } from './api-error-message';

describe('apiErrorMessage', () => {
  it('shows the message from the API error body', () => {
    const error = new HttpErrorResponse({
      status: 409,
      error: { error: { code: 'conflict', message: 'A user with that e-mail already exists.' } },
    });
    expect(apiErrorMessage(error)).toBe('A user with that e-mail already exists.');
  });

  it('says the server cannot be reached when there is no answer', () => {
    expect(apiErrorMessage(new HttpErrorResponse({ status: 0 }))).toBe('The Bellkeep server cannot be reached. Check your connection and try again.');
  });

  it('names the status when the body has another shape', () => {
    const error = new HttpErrorResponse({ status: 502, error: '<html>Bad gateway</html>' });
    expect(apiErrorMessage(error)).toBe('The server answered with status 502. Try again in a moment.');
  });
});
