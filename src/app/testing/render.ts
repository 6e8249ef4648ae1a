import { provideHttpClient, withInterceptors, type HttpInterceptorFn } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection, type EnvironmentProviders, type Provider, type Type } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

export interface Rendered<T> {
  fixture: ComponentFixture<T>;
  http: HttpTestingController;
  page: HTMLElement;
}

/** What component tests run with: zoneless, an empty router, a fake HTTP backend (behind the interceptors given). */
export function testingProviders(interceptors: HttpInterceptorFn[] = []): (Provider | EnvironmentProviders)[] {
  return [
    provideZonelessChangeDetection(),
    provideRouter([]),
    provideHttpClient(withInterceptors(interceptors)),
    provideHttpClientTesting(),
  ];
}

/** A component rendered zoneless with a fake HTTP backend and an empty router, its inputs set, and settled. */
export async function renderWithHttpTesting<T>(
  component: Type<T>,
  inputs: Record<string, unknown> = {},
  { settle = true } = {},
): Promise<Rendered<T>> {
  TestBed.configureTestingModule({ providers: testingProviders() });
  const http = TestBed.inject(HttpTestingController);
  const fixture = TestBed.createComponent(component);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  const page = fixture.nativeElement as HTMLElement;
  // A component that loads data on start never settles before the test answers its requests: tick instead.
  if (settle) await fixture.whenStable();
  else TestBed.tick();
  return { fixture, http, page };
}
