/** Links that respect the exhibit's base path (the plan's `exhibit.base`). */
export function href(path: string): string {
  const base = import.meta.env.BASE_URL.replace(/\/?$/, '/');
  return base + path.replace(/^\//, '');
}

export function roomHref(room: string): string {
  return href(`${room}/`);
}

export function panelHref(room: string, panel: string): string {
  return href(`${room}/${panel}/`);
}
