import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import type { RevisionStatus } from './review-api';
import { RevisionActions } from './revision-actions';

describe('RevisionActions', () => {
  let fixture: ComponentFixture<RevisionActions>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const NOTHING = { canSubmit: false, canApprove: false, canReturn: false, canRelease: false };

  async function render(status: RevisionStatus, can: Partial<typeof NOTHING>): Promise<HTMLElement> {
    fixture = TestBed.createComponent(RevisionActions);
    fixture.componentRef.setInput('revision', { id: 11, status, ...NOTHING, ...can });
    fixture.componentRef.setInput('subject', 'GW-0001 rev 1');
    await fixture.whenStable();
    http.expectOne('/api/revisions/11/timeline').flush({
      designId: 3,
      entries: [
        {
          id: 1,
          revisionId: 11,
          fromStatus: 'draft',
          toStatus: 'in_review',
          comment: 'Ready for a look',
          at: '2026-03-01T10:00:00.000Z',
          actor: 'Erin Example',
        },
        {
          id: 2,
          revisionId: 99,
          fromStatus: 'draft',
          toStatus: 'in_review',
          comment: 'another revision',
          at: '2026-03-01T10:00:00.000Z',
          actor: 'Erin Example',
        },
      ],
    });
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const buttons = (page: HTMLElement) => [...page.querySelectorAll('button')].map((b) => b.textContent?.trim());

  // Who may do what is the server's rule (server/designs/revision-access.ts, tests/unit/revision-access.test.ts);
  // the buttons follow the flags the server states.
  it('offers Submit when the server says the caller may submit', async () => {
    expect(buttons(await render('draft', { canSubmit: true }))).toEqual(['Submit for review']);
  });

  it('offers Approve and Return, or Release and Return, as the server allows them', async () => {
    expect(buttons(await render('in_review', { canApprove: true, canReturn: true }))).toEqual(['Approve', 'Return with comments']);
    fixture.destroy();
    expect(buttons(await render('approved', { canRelease: true, canReturn: true }))).toEqual(['Release', 'Return with comments']);
  });

  it('offers nothing the server does not allow, whatever the status', async () => {
    expect(buttons(await render('draft', {}))).toEqual([]);
    fixture.destroy();
    expect(buttons(await render('in_review', {}))).toEqual([]);
  });

  it("shows this revision's timeline with who, and the comment", async () => {
    const page = await render('in_review', { canApprove: true, canReturn: true });
    const entries = [...page.querySelectorAll('.gw-timeline li')].map((li) => li.textContent?.replace(/\s+/g, ' ').trim());
    expect(entries).toHaveLength(1);
    expect(entries[0]).toContain('Submitted for review by Erin Example');
    expect(entries[0]).toContain('Ready for a look');
  });
});
