/**
 * Alarm notifications for when the app is in the background. Permission is asked only when
 * the person taps the button for it, never on load.
 */
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
 * else directly. `tag` replaces an earlier notification of the same timer.
 */
export async function showAlarmNotification(
  title: string,
  body: string,
  tag: string,
  vibrate?: number[],
): Promise<boolean> {
  if (notifyPermission() !== 'granted') return false;
  const options: NotificationOptions & { vibrate?: number[]; renotify?: boolean } = {
    body,
    tag,
    requireInteraction: true,
    icon: '/icons/icon-192.png',
    badge: '/icons/icon-192.png',
    ...(vibrate ? { vibrate } : {}),
  };
  try {
    const registration = await navigator.serviceWorker?.getRegistration();
    if (registration) {
      await registration.showNotification(title, options);
      return true;
    }
    new Notification(title, options);
    return true;
  } catch {
    return false;
  }
}
