// The plant feature as other features see it: import from here, never from its files.
export { Crew, Equipment, LimitSetVersion, PlantUnit, PlausibleRangeVersion, Station, UnitDesignVersion } from './model';
export { countCrewsOfStation, crewNamesOf, findCrew, findStation, findUnit, firstStation, limitSetsById } from './service';
export { designInForce, limitVersionsUpTo, limitsInForce, plausibleInForce, requireUnit, unjudgedReason, versionStarts } from './versions';
