import { throwError } from 'rxjs';
import { ApiError } from '../../core/http/api-error';
import { SavedFits } from './saved-fits/saved-fits';
import { answer, mountPart, previewOf, savedOf } from './testing/study-fakes';

// The store is driven through its own methods here; SavedFits only gives it a page to live on.
describe('AnalysisStore', () => {
  it('forgets an answer to a preview discarded while it ran', async () => {
    const { api, store } = await mountPart(SavedFits);
    store.previewWindow(400, 350);
    expect(store.window()).toEqual({ minK: 350, maxK: 400 });
    store.discard('window');
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    expect(store.slots.window()).toMatchObject({ fit: null, busy: false });
    expect(store.window()).toBeNull();
  });

  it('keeps nothing while a preview is on its way, then saves the request shown', async () => {
    const { api, store } = await mountPart(SavedFits);
    store.previewWindow(350, 400);
    store.keep('window'); // the answer has not come: nothing to keep yet
    expect(api.creates).toHaveLength(0);
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    store.keep('window');
    store.keep('window');
    expect(api.creates).toHaveLength(1);
    expect(store.saving()).toBe(true);
    answer(api.creates[0], savedOf(previewOf(api.previews[0]!.body), 30));
    expect(store.saving()).toBe(false);
    expect(store.slots.window().fit).toMatchObject({ id: 30 });
  });

  it('shows a refused save beside the preview, which stays', async () => {
    const { api, store } = await mountPart(SavedFits);
    api.createFit = () =>
      throwError(() => new ApiError(403, 'forbidden', 'Your role may not save fits'));
    store.previewMetal('tcr', 293.15);
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    store.keep('model');
    expect(store.slots.model()).toMatchObject({
      problem: 'Your role may not save fits',
      fit: { kind: 'tcr' },
    });
    expect(store.saving()).toBe(false);
  });

  it('empties the slot of a kept fit when that fit is deleted', async () => {
    const { api, store } = await mountPart(SavedFits);
    store.previewWindow(350, 400);
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    store.keep('window');
    answer(api.creates[0], savedOf(previewOf(api.previews[0]!.body), 31));
    store.toggleCompared(31, true);
    store.deleteFit(31);
    expect(api.deleted).toEqual([31]);
    expect(store.slots.window().fit).toBeNull();
    expect(store.compared()).toEqual([]);
  });
});
