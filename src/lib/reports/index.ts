/** Walkthrough reports: the report model, its roll-up and the BuildingSync 2.7.0 builder. */
export * from './walkthrough-report';
export * from './roll-up';
export * from './buildingsync';
export * from './stored-economics';
export { technologyFor, resourceUnits, guideline14ModelType, FUEL_TYPE, OCCUPANCY_CLASSIFICATION, IMPLEMENTATION_STATUS } from './buildingsync-codes';
