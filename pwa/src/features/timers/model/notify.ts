/**
 * Alarm notifications for when the app is in the background. Permission is asked only when
 * the person taps the button for it, never on load.
 */
import { clickTarget, OPEN_JOB_ACTION, type AlarmNotificationData } from './alarmClick';

export type NotifyPermission = NotificationPermission | 'unsupported';

export function notifyPermission(): NotifyPermission {
  return typeof Notification === 'undefined' ? 'unsupported' : Notification.permission;
}

export async function askNotifyPermission(): Promise<NotifyPermission> {
  if (typeof Notification === 'undefined') return 'unsupported';
  try {
    return await Notification.requestPermission();
  } catch {
    return Notification.permission;
  }
}

/**
 * Shows a notification through the service worker when there is one (phones only show those),
 * else directly. `tag` replaces an earlier notification of the same timer. `data` says what a
 * tap opens: the worker (public/sw-alarms.js) reads it; the in-page fallback does the same.
 */
export async function showAlarmNotification(
  title: string,
  body: string,
  tag: string,
  vibrate?: number[],
  data?: AlarmNotificationData,
): Promise<boolean> {
  if (notifyPermission() !== 'granted') return false;
  const options: NotificationOptions & { vibrate?: number[]; renotify?: boolean } = {
    body,
    tag,
    requireInteraction: true,
    icon: '/icons/icon-192.png',
    badge: '/icons/icon-192.png',
    ...(vibrate ? { vibrate } : {}),
    ...(data ? { data } : {}),
  };
  try {
    const registration = await navigator.serviceWorker?.getRegistration();
    if (registration) {
      // Action buttons exist only on a worker's notifications.
      const actions = data?.jobId ? [{ action: OPEN_JOB_ACTION, title: 'Open job' }] : [];
      await registration.showNotification(title, { ...options, actions } as NotificationOptions);
      return true;
    }
    const shown = new Notification(title, options);
    shown.onclick = () => {
      shown.close();
      window.focus();
      const path = clickTarget(data, '');
      if (window.location.pathname !== path) window.location.assign(path);
    };
    return true;
  } catch {
    return false;
  }
}
