/** An on-off (two-position) controller with hysteresis and minimum on and off times. */
package org.loopwright.pid.onoff;
