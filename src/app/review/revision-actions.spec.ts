import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { Role } from '@shared/schemas/auth';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { Session } from '../core/session';
import { userWithRole } from '../testing/users';
import type { RevisionStatus } from './review-api';
import { RevisionActions } from './revision-actions';

const OWNER_ID = 7; // userWithRole gives every non-admin id 7
const SOMEONE_ELSE = 42;

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

  async function render(role: Role, status: RevisionStatus, ownerId: number): Promise<HTMLElement> {
    TestBed.inject(Session).replaceUser(userWithRole(role));
    fixture = TestBed.createComponent(RevisionActions);
    fixture.componentRef.setInput('revisionId', 11);
    fixture.componentRef.setInput('status', status);
    fixture.componentRef.setInput('ownerId', ownerId);
    fixture.componentRef.setInput('subject', 'GW-0001 rev 1');
    await fixture.whenStable();
    http.expectOne('/api/revisions/11/timeline').flush({
      designId: 3,
      entries: [
        { id: 1, revisionId: 11, fromStatus: 'draft', toStatus: 'in_review', comment: 'Ready for a look', at: '2026-03-01T10:00:00.000Z', actor: 'Erin Example' },
        { id: 2, revisionId: 99, fromStatus: 'draft', toStatus: 'in_review', comment: 'another revision', at: '2026-03-01T10:00:00.000Z', actor: 'Erin Example' },
      ],
    });
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const buttons = (page: HTMLElement) => [...page.querySelectorAll('button')].map((b) => b.textContent?.trim());

  it('offers the owner of a draft only Submit', async () => {
    expect(buttons(await render('engineer', 'draft', OWNER_ID))).toEqual(['Submit for review']);
  });

  it('offers nothing to an engineer who does not own the draft, nor to the owner once it is in review', async () => {
    expect(buttons(await render('engineer', 'draft', SOMEONE_ELSE))).toEqual([]);
    fixture.destroy();
    expect(buttons(await render('engineer', 'in_review', OWNER_ID))).toEqual([]);
  });

  it('offers another reviewer Approve and Return on a revision in review', async () => {
    expect(buttons(await render('reviewer', 'in_review', SOMEONE_ELSE))).toEqual(['Approve', 'Return with comments']);
  });

  it('offers another reviewer Release and Return on an approved revision', async () => {
    expect(buttons(await render('reviewer', 'approved', SOMEONE_ELSE))).toEqual(['Release', 'Return with comments']);
  });

  it('never lets the author approve or release their own revision, even as a reviewer', async () => {
    expect(buttons(await render('reviewer', 'in_review', OWNER_ID))).toEqual([]);
    fixture.destroy();
    expect(buttons(await render('reviewer', 'approved', OWNER_ID))).toEqual([]);
  });

  it('offers winders and admins nothing, and nobody anything on a released revision', async () => {
    expect(buttons(await render('winder', 'in_review', SOMEONE_ELSE))).toEqual([]);
    fixture.destroy();
    expect(buttons(await render('admin', 'approved', SOMEONE_ELSE))).toEqual([]);
    fixture.destroy();
    expect(buttons(await render('reviewer', 'released', SOMEONE_ELSE))).toEqual([]);
  });

  it("shows this revision's timeline with who, and the comment", async () => {
    const page = await render('reviewer', 'in_review', SOMEONE_ELSE);
    const entries = [...page.querySelectorAll('.gw-timeline li')].map((li) => li.textContent?.replace(/\s+/g, ' ').trim());
    expect(entries).toHaveLength(1);
    expect(entries[0]).toContain('Submitted for review by Erin Example');
    expect(entries[0]).toContain('Ready for a look');
  });
});
