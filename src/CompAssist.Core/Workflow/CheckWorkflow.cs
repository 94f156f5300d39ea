using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Numerics;
using CompAssist.Core.Parsing;
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
        if (input.Plant is null)
        {
            return CheckRun.Failed(new Problem("No plant is given", "Give the plant G(s) with --plant or in the case file."));
        }

        var (loop, fieldError, problem) = DesignWorkflow.BuildLoop(input.Plant, input.Feedback, input.Sign, input.PadeOrder);
        if (fieldError is not null)
        {
            return CheckRun.Failed(fieldError);
        }

        if (problem is not null)
        {
            return CheckRun.Failed(problem);
        }

        var c = ExpressionParser.Parse(compensator, requireProper: false);
        if (!c.IsSuccess)
        {
            return CheckRun.Failed(new FieldError("compensator", c.Error));
        }

        if (!loop!.OpenLoop(c.Value).IsProper)
        {
            return CheckRun.Failed(new Problem(
                "The compensated loop C·G·H has more zeros than poles; its closed loop is not proper",
                "Add a filter pole to the compensator (e.g. a derivative filter)."));
        }

        var selection = TargetSelector.Select(input.Requirements);
        try
        {
            var roots = RootFinder.Find(loop.Characteristic(c.Value)).Roots;
            var target = selection.IsSuccess ? selection.Value : null;
            var check = LoopCheck.Run(loop, c.Value, roots, input.Check, input.Requirements, target?.Target);
            RobustnessReport? robustness = null;
            if (!input.Variations.IsEmpty)
            {
                var sweep = RobustnessSweep.Run(loop, c.Value, input.Variations, input.Check.Intervals);
                if (!sweep.IsSuccess)
                {
                    return CheckRun.Failed(sweep.Problem);
                }

                robustness = sweep.Value;
            }

            return CheckRun.Success(new CheckResult(loop, c.Value, roots, target, check, robustness));
        }
        catch (RootFindingException e)
        {
            return CheckRun.Failed(new Problem("The closed-loop roots could not be verified: " + e.Message, "Enter the plant in factored form or reduce its order."));
        }
    }
}
