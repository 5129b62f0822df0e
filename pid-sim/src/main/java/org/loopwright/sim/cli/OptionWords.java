package org.loopwright.sim.cli;

import static java.util.Map.entry;

import java.util.Iterator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;

import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.runner.WaitStrategy;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.ModelRule;
import org.loopwright.pid.tuning.UltimatePointRule;
import org.loopwright.sim.assess.ProcessKind;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.identify.ModelKind;

/**
 * The words of every choice option, one table each: where a file has the same setting, the file's
 * table ({@link ControllerFile#INTEGRAL_METHODS}); otherwise the word the value carries (a rule's
 * label, a model kind's label). One converter class per table, for picocli's {@code converter} and
 * {@code completionCandidates}.
 */
final class OptionWords {

    /** {@code pi} or {@code pid}. */
    static final Keywords<ControllerType> CONTROLLER_TYPES = Keywords.of(entry("pi", ControllerType.PI),
            entry("pid", ControllerType.PID));

    /** {@code auto} (both), {@code pi} or {@code pid}: the types a design tries. */
    static final Keywords<DesignTypes.Choice> DESIGN_TYPES = Keywords.of(
            entry("auto", new DesignTypes.Choice(List.of(ControllerType.PI, ControllerType.PID))),
            entry("pi", new DesignTypes.Choice(List.of(ControllerType.PI))),
            entry("pid", new DesignTypes.Choice(List.of(ControllerType.PID))));

    /** {@code fopdt}, {@code sopdt}. */
    static final Keywords<ModelKind> MODEL_KINDS = Keywords.byWord(ModelKind.values(), ModelKind::label);

    /** {@code auto} (no kind: the better fit) or a model kind. */
    static final Keywords<ModelChoices.Choice> MODEL_CHOICES = Keywords.of(
            entry("auto", new ModelChoices.Choice(Optional.empty())),
            entry("fopdt", new ModelChoices.Choice(Optional.of(ModelKind.FOPDT))),
            entry("sopdt", new ModelChoices.Choice(Optional.of(ModelKind.SOPDT))));

    /** The rules from an ultimate point, by label. */
    static final Keywords<UltimatePointRule> ULTIMATE_POINT_RULES = Keywords.byWord(UltimatePointRule.values(),
            UltimatePointRule::label);

    /** The rules from a model, by label. */
    static final Keywords<ModelRule> MODEL_RULES = Keywords.byWord(ModelRule.values(), ModelRule::label);

    /** The kinds of process {@code assess} knows. */
    static final Keywords<ProcessKind> PROCESS_KINDS = Keywords.byWord(ProcessKind.values(), ProcessKind::label);

    /** How the loop runner waits. */
    static final Keywords<WaitStrategy> WAITS = Keywords.byWord(WaitStrategy.values(), WaitStrategy::word);

    private OptionWords() {
    }

    static final class ControllerTypes extends KeywordConverter<ControllerType> {
        ControllerTypes() {
            super(CONTROLLER_TYPES);
        }
    }

    static final class DesignTypes extends KeywordConverter<DesignTypes.Choice> {
        DesignTypes() {
            super(DESIGN_TYPES);
        }

        /** The types a design tries (a record, since picocli would take a bare list for a repeated option). */
        record Choice(List<ControllerType> types) {
        }
    }

    static final class ModelKinds extends KeywordConverter<ModelKind> {
        ModelKinds() {
            super(MODEL_KINDS);
        }
    }

    static final class ModelChoices extends KeywordConverter<ModelChoices.Choice> {
        ModelChoices() {
            super(MODEL_CHOICES);
        }

        /** The kind asked for, or none for the better fit (a record, since picocli unwraps a bare Optional). */
        record Choice(Optional<ModelKind> kind) {
        }
    }

    static final class UltimatePointRules extends KeywordConverter<UltimatePointRule> {
        UltimatePointRules() {
            super(ULTIMATE_POINT_RULES);
        }
    }

    /** Every rule's label, model rules first: the words of {@code tune --rule}, which set applies depends on the input. */
    static final class RuleLabels implements Iterable<String> {
        @Override
        public Iterator<String> iterator() {
            LinkedHashSet<String> labels = new LinkedHashSet<>(MODEL_RULES.words());
            labels.addAll(ULTIMATE_POINT_RULES.words());
            return labels.iterator();
        }
    }

    static final class ProcessKinds extends KeywordConverter<ProcessKind> {
        ProcessKinds() {
            super(PROCESS_KINDS);
        }
    }

    static final class Waits extends KeywordConverter<WaitStrategy> {
        Waits() {
            super(WAITS);
        }
    }

    static final class IntegralMethods extends KeywordConverter<IntegralMethod> {
        IntegralMethods() {
            super(ControllerFile.INTEGRAL_METHODS);
        }
    }

    static final class DerivativeMethods extends KeywordConverter<DerivativeMethod> {
        DerivativeMethods() {
            super(ControllerFile.DERIVATIVE_METHODS);
        }
    }
}
