import { apiaryRoutes } from './apiaries';
import { authRoutes } from './auth';
import { healthRoutes } from './health';
import { hiveRoutes } from './hives';
import type { RouteFactory } from './route';

/** Every route group, in mount order. Add a new resource's factory here. */
export const routeFactories: RouteFactory[] = [healthRoutes, authRoutes, apiaryRoutes, hiveRoutes];
