/**
 * Loopwright's PID core: the controller, its immutable settings and the exact discretisation of
 * each term. The only runtime dependency is the SLF4J API, which is never used per update;
 * {@code java.management} (in the JDK) is needed only to register a loop's status over JMX.
 */
module org.loopwright.pid {
    requires org.slf4j;
    requires static java.management;

    exports org.loopwright.pid;
    exports org.loopwright.pid.form;
    exports org.loopwright.pid.multiloop;
    exports org.loopwright.pid.discrete;
    exports org.loopwright.pid.monitor;
    exports org.loopwright.pid.onoff;
    exports org.loopwright.pid.runner;
    exports org.loopwright.pid.tuning;
}
