/**
 * Coastlines, country borders and US state borders for the front maps, from TopoJSON datasets shipped on the npm
 * registry: world-atlas 2 (Natural Earth 1:50m countries and land, public domain) and us-atlas 3 (US Census Bureau
 * cartographic boundaries 1:10m states, public domain), converted with topojson-client. `loadGeography` is the
 * file-system edge (it reads the packaged files once); the maps only receive the features.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { feature, mesh } from 'topojson-client';
import type { Topology, GeometryCollection } from 'topojson-specification';
import type { FeatureCollection, Feature, MultiLineString } from 'geojson';

/** What the maps draw under the fronts (unprojected, longitude/latitude). */
export interface Geography {
  /** Land areas; their outline is the coastline. */
  land: FeatureCollection | Feature;
  /** Borders between countries (each shared arc once). */
  countryBorders: MultiLineString;
  /** Borders between US states (each shared arc once). */
  stateBorders: MultiLineString;
  /** Where the data come from, for the page's notes. */
  credit: string;
}

let cached: Geography | null = null;

/** Read and convert the packaged TopoJSON once per process. Throws an Error naming the package when it is missing. */
export function loadGeography(): Geography {
  if (cached) return cached;
  const require = createRequire(import.meta.url);
  const read = (spec: string): Topology => {
    try {
      return JSON.parse(readFileSync(require.resolve(spec), 'utf8')) as Topology;
    } catch (e) {
      throw new Error(`cannot read the map data ${spec} (${(e as Error).message}); reinstall fropa's dependencies`, { cause: e });
    }
  };
  const world = read('world-atlas/countries-50m.json');
  const us = read('us-atlas/states-10m.json');
  const countries = world.objects.countries as GeometryCollection;
  const states = us.objects.states as GeometryCollection;
  cached = {
    land: feature(world, world.objects.land as GeometryCollection),
    countryBorders: mesh(world, countries, (a, b) => a !== b),
    stateBorders: mesh(us, states, (a, b) => a !== b),
    credit: 'Coastlines and borders: Natural Earth 1:50m (world-atlas), US Census Bureau 1:10m states (us-atlas).',
  };
  return cached;
}
