/**
 * The inbox page's script. The server renders every piece of markup; this only polls the JSON
 * API and, when the list changed, swaps in the freshly rendered parts of the same page, so
 * escaping happens in one place. It also shows dates in the viewer's zone and asks before
 * emptying the inbox.
 */
export const INBOX_SCRIPT = `
(() => {
  'use strict';
  const POLL_MS = 3000;
  const params = new URLSearchParams(location.search);
  const selectedId = params.get('id');
  const filterTo = params.get('to');
  const apiUrl = '/api/messages' + (filterTo ? '?to=' + encodeURIComponent(filterTo) : '');
  const status = document.getElementById('live-status');
  const formats = {
    short: new Intl.DateTimeFormat(undefined, {
      year: 'numeric', month: 'short', day: 'numeric',
      hour: '2-digit', minute: '2-digit', timeZoneName: 'short',
    }),
    long: new Intl.DateTimeFormat(undefined, {
      weekday: 'short', year: 'numeric', month: 'short', day: 'numeric',
      hour: '2-digit', minute: '2-digit', second: '2-digit', timeZoneName: 'short',
    }),
  };

  function localiseTimes(root) {
    for (const time of root.querySelectorAll('time[datetime][data-format]')) {
      const date = new Date(time.getAttribute('datetime'));
      const format = formats[time.dataset.format];
      if (format && !Number.isNaN(date.getTime())) time.textContent = format.format(date);
    }
  }

  function swap(next, id) {
    const fresh = next.getElementById(id);
    const current = document.getElementById(id);
    if (fresh && current) current.replaceWith(document.importNode(fresh, true));
  }

  let signature = document.getElementById('message-list').dataset.signature;
  let busy = false;

  async function refresh(messages) {
    const before = new Set(signature ? signature.split(',') : []);
    const response = await fetch(location.href, { cache: 'no-store' });
    const next = new DOMParser().parseFromString(await response.text(), 'text/html');
    const focused = document.activeElement && document.activeElement.closest('[data-id]');
    const focusedId = focused ? focused.dataset.id : null;
    swap(next, 'message-list');
    swap(next, 'message-count');
    if (selectedId && !messages.some((message) => message.id === selectedId)) swap(next, 'message');
    document.title = next.title;
    signature = document.getElementById('message-list').dataset.signature;
    localiseTimes(document);
    if (focusedId) {
      const again = document.querySelector('[data-id="' + CSS.escape(focusedId) + '"]');
      if (again) again.focus();
    }
    const arrived = messages.filter((message) => !before.has(message.id)).length;
    status.textContent =
      arrived === 1 ? '1 new message' : arrived > 1 ? arrived + ' new messages' : 'Inbox updated';
  }

  async function poll() {
    if (busy || document.hidden) return;
    busy = true;
    try {
      const response = await fetch(apiUrl, { cache: 'no-store' });
      if (!response.ok) return;
      const messages = await response.json();
      if (messages.map((message) => message.id).join(',') !== signature) await refresh(messages);
    } catch {
      // The sink may be restarting; the next tick tries again.
    } finally {
      busy = false;
    }
  }

  const emptyButton = document.getElementById('empty-inbox');
  const dialog = document.getElementById('confirm-empty');
  emptyButton.hidden = false;
  emptyButton.addEventListener('click', () => {
    // Esc closes a dialog without touching returnValue, so clear what an earlier close left.
    dialog.returnValue = '';
    dialog.showModal();
  });
  dialog.addEventListener('close', async () => {
    if (dialog.returnValue !== 'confirm') {
      emptyButton.focus();
      return;
    }
    const response = await fetch('/api/messages', { method: 'DELETE' });
    if (response.ok) {
      location.assign('/');
    } else {
      status.textContent = 'The inbox could not be emptied (HTTP ' + response.status + ').';
      emptyButton.focus();
    }
  });

  localiseTimes(document);
  const current = document.querySelector('.item[aria-current="page"]');
  if (current) current.focus({ preventScroll: false });
  setInterval(poll, POLL_MS);
  document.addEventListener('visibilitychange', () => {
    if (!document.hidden) void poll();
  });
})();
`;
