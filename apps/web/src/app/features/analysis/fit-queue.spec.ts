import type { FitPreviewDto, FitRequest } from '@rhotrace/api-types';
import { Subject, throwError } from 'rxjs';
import { ApiError } from '../../core/http/api-error';
import { type FitAnswer, type FitJob, queuedFits } from './fit-queue';
import { previewOf } from './testing/study-fakes';

const windowFit = (minK: number, maxK: number): FitRequest => ({ kind: 'arrhenius', minK, maxK });

describe('queuedFits', () => {
  function harness() {
    const calls: Array<{ body: FitRequest; answer: Subject<FitPreviewDto> }> = [];
    const jobs = new Subject<FitJob<'window' | 'model'>>();
    const answers: Array<FitAnswer<'window' | 'model'>> = [];
    jobs
      .pipe(
        queuedFits<'window' | 'model'>((body) => {
          const answer = new Subject<FitPreviewDto>();
          calls.push({ body, answer });
          return answer;
        }),
      )
      .subscribe((a) => answers.push(a));
    const reply = (i: number) => {
      const call = calls[i]!;
      call.answer.next(previewOf(call.body));
      call.answer.complete();
    };
    return { calls, jobs, answers, reply };
  }

  it('runs a second drag only after the first has answered, so answers come in order', () => {
    const { calls, jobs, answers, reply } = harness();
    jobs.next({ slot: 'window', body: windowFit(300, 400) });
    jobs.next({ slot: 'model', body: { kind: 'bloch-gruneisen' } });
    expect(calls).toHaveLength(1); // the second waits: no race
    reply(0);
    expect(calls).toHaveLength(2);
    reply(1);
    expect(answers.map((a) => [a.slot, a.current])).toEqual([
      ['window', true],
      ['model', true],
    ]);
  });

  it('skips a waiting drag overtaken by a newer one for the same slot, and marks the overtaken answer', () => {
    const { calls, jobs, answers, reply } = harness();
    jobs.next({ slot: 'window', body: windowFit(300, 400) });
    jobs.next({ slot: 'window', body: windowFit(310, 410) });
    jobs.next({ slot: 'window', body: windowFit(320, 420) });
    reply(0);
    // The 310–410 request never runs: the 320–420 one replaced it while it waited.
    expect(calls.map((c) => c.body.minK)).toEqual([300, 320]);
    expect(answers[0]).toMatchObject({ current: false });
    reply(1);
    expect(answers[1]).toMatchObject({ current: true, body: { minK: 320 } });
  });

  it('turns a refused fit into the API message and keeps the queue running', () => {
    const answers: Array<FitAnswer<'window'>> = [];
    const jobs = new Subject<FitJob<'window'>>();
    let runs = 0;
    jobs
      .pipe(
        queuedFits<'window'>(() => {
          runs += 1;
          return runs === 1
            ? throwError(() => new ApiError(400, 'bad_request', 'The window holds 2 points'))
            : new Subject<FitPreviewDto>().asObservable();
        }),
      )
      .subscribe((a) => answers.push(a));
    jobs.next({ slot: 'window', body: windowFit(300, 301) });
    jobs.next({ slot: 'window', body: windowFit(300, 400) });
    expect(answers[0]).toMatchObject({ fit: null, problem: 'The window holds 2 points' });
    expect(runs).toBe(2);
  });

  it('on cancel, aborts the running request of that slot, drops its waiting one and answers neither', () => {
    const calls: Array<{ body: FitRequest; answer: Subject<FitPreviewDto> }> = [];
    const jobs = new Subject<FitJob<'window' | 'model'>>();
    const cancel = new Subject<'window' | 'model'>();
    const answers: Array<FitAnswer<'window' | 'model'>> = [];
    jobs
      .pipe(
        queuedFits<'window' | 'model'>((body) => {
          const answer = new Subject<FitPreviewDto>();
          calls.push({ body, answer });
          return answer;
        }, cancel),
      )
      .subscribe((a) => answers.push(a));
    jobs.next({ slot: 'model', body: { kind: 'bloch-gruneisen' } });
    jobs.next({ slot: 'model', body: { kind: 'tcr' } });
    jobs.next({ slot: 'window', body: windowFit(300, 400) });
    expect(calls[0]!.answer.observed).toBe(true);
    cancel.next('model');
    // Unsubscribed: HttpClient aborts the request it stands for.
    expect(calls[0]!.answer.observed).toBe(false);
    // The waiting model job is dropped; the window job runs.
    expect(calls.map((c) => c.body.kind)).toEqual(['bloch-gruneisen', 'arrhenius']);
    calls[1]!.answer.next(previewOf(calls[1]!.body));
    calls[1]!.answer.complete();
    expect(answers.map((a) => a.slot)).toEqual(['window']);
  });
});
