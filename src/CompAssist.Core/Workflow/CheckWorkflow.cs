using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Numerics;
using CompAssist.Core.Proof;
using CompAssist.Core.Targets;

namespace CompAssist.Core.Workflow;

/// <summary>Proves a compensator the user already has on the loop a case describes.</summary>
public static class CheckWorkflow
{
    /// <summary>Runs the proof of <paramref name="compensator"/> (an expression; ideal PD/PID allowed).</summary>
    public static CheckRun Run(CaseFile input, string compensator)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(compensator);
        var read = CompensatedLoop.Read(input, compensator);
        if (read.FieldError is { } fieldError)
        {
            return CheckRun.Failed(fieldError);
        }

        if (read.Problem is { } problem)
        {
            return CheckRun.Failed(problem);
        }

        var loop = read.Loop!;
        var c = read.Compensator!;
        var selection = TargetSelector.Select(input.Requirements);
        try
        {
            var roots = RootFinder.Find(loop.Characteristic(c)).Roots;
            var target = selection.IsSuccess ? selection.Value : null;
            var check = LoopCheck.Run(loop, c, roots, input.Check, input.Requirements, target?.Target);
            RobustnessReport? robustness = null;
            if (!input.Variations.IsEmpty)
            {
                var sweep = RobustnessSweep.Run(loop, c, input.Variations, input.Requirements);
                if (!sweep.IsSuccess)
                {
                    return CheckRun.Failed(sweep.Problem);
                }

                robustness = sweep.Value;
            }

            return CheckRun.Success(new CheckResult(loop, c, roots, target, check, robustness));
        }
        catch (RootFindingException e)
        {
            return CheckRun.Failed(new Problem("The closed-loop roots could not be verified: " + e.Message, "Enter the plant in factored form or reduce its order."));
        }
    }
}
