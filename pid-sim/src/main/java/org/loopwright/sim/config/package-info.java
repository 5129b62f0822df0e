/**
 * Reading the harness's input files with errors that point into them: a YAML document with the
 * line and column of every node, typed readers that name the key, the value and what is allowed,
 * and the controller file that maps to {@link org.loopwright.pid.ControllerSettings}.
 */
package org.loopwright.sim.config;
