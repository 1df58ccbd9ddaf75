/// <reference types="astro/client" />
declare namespace App {
  interface Locals {
    user: import('./server/http').RequestUser | null;
    /** this request's id (X-Request-Id), for error pages */
    requestId: string;
  }
}
