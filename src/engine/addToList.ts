/**
 * Adds `value` to the list kept in `lists` under `key`, starting the list on first use. It pushes
 * onto the list already kept: copying it for each value would cost a bus with k branches k²/2.
 *
 * @example const motorsOn = new Map<string, Motor[]>(); for (const m of motors) addToList(motorsOn, m.bus, m);
 */
export function addToList<K, V>(lists: Map<K, V[]>, key: K, value: V): void {
  const list = lists.get(key);
  if (list) list.push(value);
  else lists.set(key, [value]);
}
