import { apiaryRoutes } from './apiaries';
import { authRoutes } from './auth';
import { healthRoutes } from './health';
import { hiveRoutes } from './hives';
import { peopleRoutes } from './people';
import { photoRoutes } from './photos';
import { recordRoutes } from './records';
import type { RouteFactory } from './route';
import { exportRoutes } from './exports';
import { seasonRoutes } from './season';
import { sensorRoutes } from './sensors';
import { storyRoutes } from './story';
import { taskRoutes } from './tasks';

/** Every route group, in mount order. Add a new resource's factory here. */
export const routeFactories: RouteFactory[] = [healthRoutes, authRoutes, apiaryRoutes, hiveRoutes, peopleRoutes, taskRoutes, storyRoutes, recordRoutes, photoRoutes, seasonRoutes, sensorRoutes, exportRoutes];
