namespace CompAssist.Core.Simulation;

/// <summary>How the step figures were obtained.</summary>
public enum StepSolution
{
    /// <summary>The exact solution of a delay-free loop (exact transitions, events solved by Newton).</summary>
    Exact,

    /// <summary>The loop with its delays exact, by the method of steps on a fine grid (O(h²) between samples).</summary>
    ExactDelay,

    /// <summary>The loop with its delays replaced by the Padé approximant (a delay far shorter than the horizon).</summary>
    PadeApproximant,
}
