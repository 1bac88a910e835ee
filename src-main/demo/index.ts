/** The invented demo scenario and the seeding that fills an empty data folder with it. */
export * from './demoScenario.js';
export * from './seedDemo.js';
