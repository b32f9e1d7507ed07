/**
 * The user's own defaults (archive, port, calibration, operator) from the environment
 * and a config file in the user's config folder, each with where it came from. No JavaFX, no
 * ports.
 */
package org.loadstone.config;
