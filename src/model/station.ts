/** Station metadata: where a station is and what fropa knows about its surroundings. */

/** Station metadata (from a stations file or from CSV columns). */
export interface StationMeta {
  id: string;
  /** Other ids some files use for the same station (e.g. 3-letter id for a 4-letter ICAO id). */
  aliases: string[];
  name?: string;
  latDeg: number;
  lonDeg: number;
  elevationM: number;
  /** Coastal flag from the stations file (`coastal` column), used by the sea-breeze classifier. */
  coastal?: boolean;
  /** Direction the sea lies toward, degrees true (onshore wind blows from it), when known. */
  seaBearingDeg?: number;
  /** IANA zone of the station's naive local times (stations file `tz`), for CSV files that give no zone. */
  timeZone?: string;
}
