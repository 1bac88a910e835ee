/** Which place of the job is showing; kept in the address fragment so a reload stays put. */
export const places = [
  { id: 'plan', label: 'Plan', hint: 'Design a test before the run' },
  { id: 'inspect', label: 'Inspect', hint: 'Enter results of a run on the floor' },
  { id: 'records', label: 'Records', hint: 'Every run: history, read-only view, decision record and CSV' },
  { id: 'sources', label: 'Sources', hint: 'Suppliers, lines and machines: their parts, runs and settings' },
] as const;

export type PlaceId = (typeof places)[number]['id'];

function placeFromHash(): PlaceId {
  const wanted = window.location.hash.replace(/^#\/?/, '').split('/')[0];
  return places.find((place) => place.id === wanted)?.id ?? 'plan';
}

class Navigation {
  current = $state<PlaceId>(placeFromHash());

  go(place: PlaceId): void {
    this.current = place;
    history.replaceState(null, '', `#/${place}`);
  }
}

export const navigation = new Navigation();
window.addEventListener('hashchange', () => {
  navigation.current = placeFromHash();
});
