// Panelpass: what tapping a timer alarm's notification does. Imported by the generated service
// worker (workbox.importScripts in pwa/vite.config.ts), so it is stored with the worker and
// works offline. The rules mirror src/features/timers/model/alarmClick.ts line for line;
// alarmClick.test.ts runs this file and that module on the same cases.
(function (self) {
  'use strict';

  var OPEN_JOB_ACTION = 'open-job';

  function alarmPath(jobId) {
    return jobId ? '/jobs/' + encodeURIComponent(jobId) : '/';
  }

  function ownPath(value) {
    return typeof value === 'string' && /^\/(?![/\\])/.test(value) ? value : null;
  }

  function clickTarget(data, action) {
    var d = data !== null && typeof data === 'object' ? data : {};
    if (action === OPEN_JOB_ACTION && typeof d.jobId === 'string' && d.jobId) {
      return alarmPath(d.jobId);
    }
    return ownPath(d.url) || '/';
  }

  function pickClient(windows, origin) {
    var best = -1;
    var bestScore = -1;
    windows.forEach(function (w, i) {
      var sameOrigin = false;
      try {
        sameOrigin = new URL(w.url).origin === origin;
      } catch (_e) {
        sameOrigin = false;
      }
      if (!sameOrigin) return;
      var score = w.focused ? 2 : w.visibilityState === 'visible' ? 1 : 0;
      if (score > bestScore) {
        best = i;
        bestScore = score;
      }
    });
    return best;
  }

  // Brings an open Panelpass window forward on the target page, or opens one there.
  async function open(data, action) {
    var origin = self.location.origin;
    var url = new URL(clickTarget(data, action || ''), origin).href;
    var windows = await self.clients.matchAll({ type: 'window', includeUncontrolled: true });
    var i = pickClient(windows, origin);
    if (i < 0) return self.clients.openWindow(url);
    var client = windows[i];
    // Focusing is allowed only while the tap is being handled; without it, still navigate.
    client =
      (await client.focus().catch(function () {
        return null;
      })) || client;
    if (client.url === url) return client;
    var moved = await client.navigate(url).catch(function () {
      return null;
    });
    return moved || self.clients.openWindow(url);
  }

  // A tap on the notification or one of its buttons: close it, then open what it is about.
  function tap(notification, action) {
    notification.close();
    return open(notification.data, action);
  }

  self.__panelpassAlarm = { clickTarget: clickTarget, pickClient: pickClient };
  // For the browser test, which cannot dispatch a notificationclick itself.
  self.__panelpassTap = tap;

  if (typeof self.addEventListener === 'function') {
    self.addEventListener('notificationclick', function (event) {
      event.waitUntil(tap(event.notification, event.action));
    });
  }
})(self);
