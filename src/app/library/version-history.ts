import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  contentChildren,
  input,
  output,
  viewChild,
  type AfterContentInit,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatColumnDef, MatTable, MatTableModule } from '@angular/material/table';

/** What the history shows of every version, whatever else the library keeps. */
export interface ListedVersion {
  version?: number;
  /** Only libraries that answer it mark the current version. */
  current?: boolean;
  retired?: boolean;
  createdBy?: string | null;
  createdAt?: string;
}

/**
 * Every version of one library item, newest first: its number and state, the page's own columns (projected
 * `matColumnDef`s named in `columns`), who made it and when; a button closes it.
 */
@Component({
  selector: 'gw-version-history',
  imports: [DatePipe, MatButtonModule, MatTableModule],
  templateUrl: './version-history.html',
  styleUrl: './version-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VersionHistory<V extends ListedVersion> implements AfterContentInit {
  /** The item's name, as the heading says it. */
  readonly name = input.required<string>();
  /** "material", "core": names the scrollable region. */
  readonly noun = input.required<string>();
  readonly versions = input.required<V[]>();
  /** The page's own columns, between the version and its author. */
  readonly columns = input.required<readonly string[]>();
  /** Shown when a version has no author (demo data, a deleted account). */
  readonly unknownAuthor = input('—');
  readonly closed = output();

  protected readonly titleId = `gw-history-title-${nextId++}`;
  protected readonly shownColumns = computed(() => ['version', ...this.columns(), 'createdBy', 'createdAt']);
  private readonly table = viewChild.required(MatTable);
  private readonly projected = contentChildren(MatColumnDef);

  // The table must know the page's columns before it renders a row.
  ngAfterContentInit(): void {
    for (const column of this.projected()) this.table().addColumnDef(column);
  }
}

let nextId = 0;
