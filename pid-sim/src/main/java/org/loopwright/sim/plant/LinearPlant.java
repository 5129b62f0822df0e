package org.loopwright.sim.plant;

import java.util.Arrays;

/**
 * A linear plant stepped exactly: between two instants the input is constant, so the state moves by
 * x ← Φ(τ)·x + Γ(τ)·u with Φ(τ) = e^(Aτ) and Γ(τ) = ∫₀^τ e^(As)·B ds, both read from one matrix
 * exponential of [[A, B], [0, 0]]·τ (zero-order-hold discretisation; Åström &amp; Wittenmark,
 * <i>Computer-Controlled Systems</i>, 3rd ed., 1997, §2.3). The realisation is the controllable
 * canonical form of the transfer function.
 *
 * <p>A dead time L is exact for any L, whole number of periods or not: the inputs are kept as held
 * pieces (value, length) in a queue that starts with L seconds of zero input, and each advance
 * integrates exactly across the piece boundaries that fall inside it. Nothing is rounded, except
 * that a boundary within a billionth of an interval from the interval's end is put at its end: a dead
 * time of a whole number of periods then costs one step per period, not a step and a sliver.
 *
 * <p>Φ and Γ are cached by interval length (the last 64 lengths), so a
 * fixed-period simulation computes them once or twice and then allocates nothing. A biproper
 * transfer function (deg N = deg D) feeds the held input straight through to {@link #output()}.
 *
 * <p>{@link #adopt} swaps in another model of the same order without allocating, so a sweep
 * reuses one plant per thread across its runs.
 *
 * <p>Example: {@code Plant p = new LinearPlant(TransferFunction.fopdt(2.0, 30.0, 5.5));}
 *
 * <p>Not thread-safe: one simulation owns a plant.
 */
public final class LinearPlant implements Plant {

    private static final int CACHED_LENGTHS = 64;
    /** A power of two, like every capacity after it, so the ring wraps with a mask. */
    private static final int INITIAL_PIECES = 16;
    /**
     * A piece that ends within this share of an interval from the interval's end ends at its end:
     * a dead time of n periods, consumed a period at a time, otherwise leaves a float-rounding sliver
     * (of the order of 1e-15 s) that would split every later period in two.
     */
    private static final double SLIVER = 1e-9;

    private final int order;
    private final double[] stateMatrix;
    private final double[] inputVector;
    private final double[] outputVector;
    private TransferFunction model;
    private double feedthrough;
    private double deadTimeSeconds;

    private final double[] state;
    private final double[] scratch;
    private double heldInput;

    private final double[] cachedSeconds = new double[CACHED_LENGTHS];
    private final double[][] cachedTransition;
    private final double[][] cachedInputResponse;
    // the discretisation last used, so a fixed period looks nothing up, and the one before it, so a dead
    // time that is not a whole number of periods (two held pieces per period, in turn) looks nothing up either
    private double currentSeconds = Double.NaN;
    private double[] currentTransition;
    private double[] currentInputResponse;
    private double previousSeconds = Double.NaN;
    private double[] previousTransition;
    private double[] previousInputResponse;
    private int nextSlot;

    // the delay line: a ring of held pieces, oldest first
    private double[] pieceInput = new double[INITIAL_PIECES];
    private double[] pieceSeconds = new double[INITIAL_PIECES];
    private int first;
    private int pieces;
    private double firstConsumedSeconds;

    /** A plant at rest for the given model. */
    public LinearPlant(TransferFunction model) {
        order = model.denominator().length - 1;
        stateMatrix = new double[order * order];
        inputVector = new double[order];
        outputVector = new double[order];
        state = new double[order];
        scratch = new double[order];
        cachedTransition = new double[CACHED_LENGTHS][order * order];
        cachedInputResponse = new double[CACHED_LENGTHS][order];
        adopt(model);
    }

    /**
     * Takes another model of the same order, at rest: its realisation replaces this one's and the
     * cached discretisations are dropped (computed again as the new model meets each interval length).
     * Allocates nothing beyond what reading the model's coefficients costs.
     *
     * @throws IllegalArgumentException when the model's order differs from this plant's
     */
    public void adopt(TransferFunction newModel) {
        double[] den = newModel.denominator();
        double[] num = newModel.numerator();
        if (den.length - 1 != order) {
            throw new IllegalArgumentException("a plant takes only a model of its own order " + order
                    + ": denominator=" + Arrays.toString(den));
        }
        model = newModel;
        double lead = den[0];
        // beta: the numerator over the leading denominator coefficient, padded to order + 1 coefficients
        int pad = order + 1 - num.length;
        feedthrough = pad == 0 ? num[0] / lead : 0.0;
        Arrays.fill(stateMatrix, 0.0);
        for (int j = 0; j + 1 < order; j++) {
            stateMatrix[j * order + j + 1] = 1.0;
        }
        for (int j = 0; j < order; j++) {
            double a = den[order - j] / lead;
            int betaIndex = order - j;
            double beta = betaIndex >= pad ? num[betaIndex - pad] / lead : 0.0;
            stateMatrix[(order - 1) * order + j] = -a;
            outputVector[j] = beta - feedthrough * a;
        }
        if (order > 0) {
            inputVector[order - 1] = 1.0;
        }
        deadTimeSeconds = newModel.deadTimeSeconds();
        Arrays.fill(cachedSeconds, Double.NaN);
        currentSeconds = Double.NaN;
        currentTransition = null;
        previousSeconds = Double.NaN;
        nextSlot = 0;
        reset();
    }

    /** Whether {@link #adopt} takes this model: a transfer function of this plant's order. */
    public boolean fits(TransferFunction candidate) {
        return candidate.denominator().length - 1 == order;
    }

    /** The transfer function this plant realises. */
    public TransferFunction model() {
        return model;
    }

    @Override
    public void reset() {
        Arrays.fill(state, 0.0);
        heldInput = 0.0;
        first = 0;
        pieces = 0;
        firstConsumedSeconds = 0.0;
        if (deadTimeSeconds > 0.0) {
            enqueue(0.0, deadTimeSeconds);
        }
    }

    @Override
    public double output() {
        double y = feedthrough * heldInput;
        for (int i = 0; i < order; i++) {
            y += outputVector[i] * state[i];
        }
        return y;
    }

    @Override
    public void advance(double inputHeldOverInterval, double seconds) {
        if (!(seconds > 0.0)) {
            return;
        }
        if (deadTimeSeconds == 0.0) {
            hold(inputHeldOverInterval, seconds);
            return;
        }
        enqueue(inputHeldOverInterval, seconds);
        if (firstConsumedSeconds == 0.0 && pieceSeconds[first] == seconds) {
            // the common case: the oldest piece is exactly this interval long
            hold(pieceInput[first], seconds);
            dropFirst();
        } else {
            consume(seconds);
        }
    }

    /** Holds the pieces that fall in the next {@code seconds}, in order, splitting at their boundaries. */
    private void consume(double seconds) {
        double sliver = SLIVER * seconds;
        double remaining = seconds;
        while (remaining > 0.0 && pieces > 0) {
            double left = pieceSeconds[first] - firstConsumedSeconds;
            if (left > remaining + sliver) {
                hold(pieceInput[first], remaining);
                firstConsumedSeconds += remaining;
                return;
            }
            // the piece ends inside this interval; ending within a sliver of its end, it ends at its end
            double held = left < remaining - sliver ? left : remaining;
            hold(pieceInput[first], held);
            remaining -= held;
            dropFirst();
        }
    }

    private void dropFirst() {
        first = (first + 1) & (pieceInput.length - 1);
        pieces--;
        firstConsumedSeconds = 0.0;
    }

    private void hold(double input, double seconds) {
        heldInput = input;
        if (order == 0 || !(seconds > 0.0)) {
            return;
        }
        if (seconds != currentSeconds) {
            select(seconds);
        }
        double[] phi = currentTransition;
        double[] gamma = currentInputResponse;
        if (order == 1) {
            state[0] = phi[0] * state[0] + gamma[0] * input;
            return;
        }
        for (int i = 0; i < order; i++) {
            double sum = gamma[i] * input;
            int row = i * order;
            for (int j = 0; j < order; j++) {
                sum += phi[row + j] * state[j];
            }
            scratch[i] = sum;
        }
        System.arraycopy(scratch, 0, state, 0, order);
    }

    /** Makes Φ(τ), Γ(τ) for τ = seconds current, from the cache or computed into its oldest slot. */
    private void select(double seconds) {
        double[] transition = currentTransition;
        double[] inputResponse = currentInputResponse;
        double lastSeconds = currentSeconds;
        if (seconds == previousSeconds) {
            currentSeconds = previousSeconds;
            currentTransition = previousTransition;
            currentInputResponse = previousInputResponse;
        } else {
            lookUp(seconds);
        }
        previousSeconds = lastSeconds;
        previousTransition = transition;
        previousInputResponse = inputResponse;
    }

    private void lookUp(double seconds) {
        int slot = -1;
        for (int i = 0; i < CACHED_LENGTHS && slot < 0; i++) {
            if (cachedSeconds[i] == seconds) {
                slot = i;
            }
        }
        if (slot < 0) {
            if (cachedTransition[nextSlot] == currentTransition) {
                nextSlot = (nextSlot + 1) % CACHED_LENGTHS; // the current one is about to be the previous: keep it
            }
            slot = nextSlot;
            nextSlot = (nextSlot + 1) % CACHED_LENGTHS;
            discretise(seconds, cachedTransition[slot], cachedInputResponse[slot]);
            cachedSeconds[slot] = seconds;
        }
        currentSeconds = seconds;
        currentTransition = cachedTransition[slot];
        currentInputResponse = cachedInputResponse[slot];
    }

    /** Φ(τ) and Γ(τ) from e^([[A, B], [0, 0]]·τ) = [[Φ(τ), Γ(τ)], [0, 1]]. */
    private void discretise(double seconds, double[] transition, double[] inputResponse) {
        int size = order + 1;
        double[] exponential = MatrixExponential.ofHold(stateMatrix, inputVector, order, seconds);
        for (int i = 0; i < order; i++) {
            System.arraycopy(exponential, i * size, transition, i * order, order);
            inputResponse[i] = exponential[i * size + order];
        }
    }

    private void enqueue(double input, double seconds) {
        if (pieces == pieceInput.length) {
            grow();
        }
        int slot = (first + pieces) & (pieceInput.length - 1);
        pieceInput[slot] = input;
        pieceSeconds[slot] = seconds;
        pieces++;
    }

    /** Only when more pieces are in flight than ever before (a dead time of many periods, at warm-up). */
    private void grow() {
        int capacity = pieceInput.length * 2;
        double[] inputs = new double[capacity];
        double[] lengths = new double[capacity];
        for (int i = 0; i < pieces; i++) {
            int from = (first + i) & (pieceInput.length - 1);
            inputs[i] = pieceInput[from];
            lengths[i] = pieceSeconds[from];
        }
        pieceInput = inputs;
        pieceSeconds = lengths;
        first = 0;
    }
}
