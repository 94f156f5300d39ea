using System.Collections.Immutable;
using System.Numerics;
using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Model;
using CompAssist.Core.Parsing;
using CompAssist.Core.Proof;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Targets;
using CompAssist.Core.Workflow;

namespace CompAssist.Core.Editing;

/// <summary>
/// One editing session over a case, for an interactive front end: every change makes a new immutable
/// <see cref="CaseFile"/>, redesigns and re-proves at once, and can be undone. A change that cannot be designed
/// keeps the last good design beside the reason. The robustness sweep is left to the caller
/// (<see cref="PendingSweep"/>) so that a front end can run it without blocking input.
/// Not thread-safe: call it from one thread (the UI's).
/// </summary>
public sealed class DesignSession
{
    /// <summary>Most undo steps kept.</summary>
    public const int UndoDepth = 500;

    private readonly List<Change> undo = [];
    private readonly List<Change> redo = [];
    private readonly Lock autosaveLock = new();
    private string savedText;

    // The case as the case file would hold it, kept with the case: dirtiness and "did anything change" are
    // text comparisons against it, so each change writes the case text once.
    private string caseText;

    // True once this session has written its autosave file: only then may it remove that file. An autosave
    // found at start belongs to an earlier session until the user restores or discards it.
    private bool ownsAutosave;

    /// <summary>
    /// Starts a session on a case; <paramref name="path"/> is where it was read from (null for a new case), and
    /// <paramref name="workingDirectory"/> holds the autosave of a new case (default: the current directory).
    /// </summary>
    public DesignSession(CaseFile initial, string? path, string? workingDirectory = null)
    {
        ArgumentNullException.ThrowIfNull(initial);
        Case = initial;
        Path = path is null ? null : System.IO.Path.GetFullPath(path);
        WorkingDirectory = workingDirectory ?? Directory.GetCurrentDirectory();
        caseText = CaseFileWriter.Write(initial);
        savedText = path is null ? string.Empty : caseText;
        Latest = Redesign(initial);
        CurrentTarget = TargetOf(initial, Latest, null);
        MotionScale = CurrentTarget is { } t0 && t0.Magnitude > 0 ? t0.Magnitude : 1.0;
        if (Latest.Report is not null)
        {
            LastGood = Latest.Report;
        }
    }

    /// <summary>The case as it stands.</summary>
    public CaseFile Case { get; private set; }

    /// <summary>The file the case is saved to, or null for a new case never saved.</summary>
    public string? Path { get; private set; }

    /// <summary>Where a new case's autosave goes.</summary>
    public string WorkingDirectory { get; }

    /// <summary>The design of <see cref="Case"/>: a report, or why there is none.</summary>
    public DesignRun Latest { get; private set; }

    /// <summary>The most recent successful design (kept while a change is refused).</summary>
    public DesignReport? LastGood { get; private set; }

    /// <summary>The robustness sweep of <see cref="LastGood"/>, once run.</summary>
    public RobustnessReport? Robustness { get; private set; }

    /// <summary>Why the last sweep could not run, if it could not.</summary>
    public Problem? RobustnessProblem { get; private set; }

    /// <summary>The target pole being designed for (upper half-plane), or null when none can be chosen yet.</summary>
    public Complex? CurrentTarget { get; private set; }

    /// <summary>The reference size for target steps: the distance of the requirement corner (or first target) from the origin.</summary>
    public double MotionScale { get; private set; } = 1.0;

    /// <summary>Increases with every change; a sweep started at one revision is stale at the next.</summary>
    public int Revision { get; private set; }

    /// <summary>How arrow keys move the target (see <see cref="ToggleMode"/>).</summary>
    public MotionMode Mode { get; private set; } = MotionMode.RealImaginary;

    /// <summary>Coarse or fine moves (see <see cref="ToggleSize"/>).</summary>
    public StepSize Size { get; private set; } = StepSize.Coarse;

    /// <summary>What the last action did, in one line for a status bar.</summary>
    public string Status { get; private set; } = string.Empty;

    /// <summary>True when the case differs from the file it came from (a new case is dirty once changed).</summary>
    public bool IsDirty => caseText != savedText && !(Path is null && undo.Count == 0);

    /// <summary>True when there is a change to undo.</summary>
    public bool CanUndo => undo.Count > 0;

    /// <summary>True when there is an undone change to redo.</summary>
    public bool CanRedo => redo.Count > 0;

    /// <summary>What <see cref="Undo"/> would undo.</summary>
    public string? UndoLabel => undo.Count > 0 ? undo[^1].What : null;

    /// <summary>The sweep the current design still needs, or null when there is none to run.</summary>
    public SweepRequest? PendingSweep =>
        Latest.Report is { } report && !Case.Variations.IsEmpty && Robustness is null && RobustnessProblem is null
            ? new SweepRequest(Revision, report.Design.Loop, report.Design.Compensator.TransferFunction, Case.Variations, Case.Requirements)
            : null;

    /// <summary>Where the autosave of this session goes: beside the case, or in <see cref="WorkingDirectory"/> for a new case.</summary>
    public string AutosavePath => AutosaveFiles.PathFor(Path, WorkingDirectory);

    /// <summary>Edits one field from its typed text. Returns the positioned error, or null when accepted (or unchanged).</summary>
    public ParseError? Edit(CaseField field, string text)
    {
        var edit = CaseFieldText.Apply(Case, field, text);
        if (!edit.IsSuccess)
        {
            return edit.Error;
        }

        var next = edit.Case;
        if (CaseFieldText.CornerFields.Contains(field))
        {
            next = next with { Requirements = next.Requirements with { Point = null } };
        }

        Commit(next, $"edit {FieldNames.Of(field)}", coalesceKey: "field:" + field);
        return null;
    }

    /// <summary>Switches between σ/ωd moves and ζ/ωn moves.</summary>
    public void ToggleMode() => Mode = Mode == MotionMode.RealImaginary ? MotionMode.DampingFrequency : MotionMode.RealImaginary;

    /// <summary>Switches between coarse and fine steps.</summary>
    public void ToggleSize() => Size = Size == StepSize.Coarse ? StepSize.Fine : StepSize.Coarse;

    /// <summary>Moves the target by one arrow-key step in the current mode, of the current size unless <paramref name="size"/> is given.</summary>
    public bool MoveTarget(MoveDirection direction, StepSize? size = null)
    {
        if (CurrentTarget is not { } from)
        {
            Status = "No target yet: give requirements (overshoot, settling time, ζ/ωn) or type a point.";
            return false;
        }

        var to = TargetMotion.Move(from, direction, Mode, size ?? Size, MotionScale);
        return SetTarget(to, $"move target to {TransferFunctionFormatter.Complex(to, 4)}");
    }

    /// <summary>Puts the target at an exact point (upper half-plane; a negative imaginary part is mirrored).</summary>
    public bool SetTarget(Complex point, string? what = null)
    {
        if (!double.IsFinite(point.Real) || !double.IsFinite(point.Imaginary))
        {
            throw new ArgumentOutOfRangeException(nameof(point), point, "The target must be finite.");
        }

        point = new Complex(point.Real, Math.Abs(point.Imaginary));
        return Commit(Case with { Requirements = Case.Requirements with { Point = point } }, what ?? $"set target to {TransferFunctionFormatter.Complex(point, 4)}", null);
    }

    /// <summary>
    /// A search the session can run for the case as it stands (null when the requirements span no region):
    /// its requirements with the target taken out, so that the region is searched, not the current point.
    /// </summary>
    public CaseFile? SearchableCase()
    {
        var open = Case with { Requirements = Case.Requirements with { Point = null } };
        return DesignWorkflow.Searches(open) ? open : null;
    }

    /// <summary>Takes a searched candidate's target and free choices into the case (one undo step).</summary>
    public bool TakeSearched(Search.SearchChoice choice, string what)
    {
        ArgumentNullException.ThrowIfNull(choice);
        var point = choice.Target.Point;
        return Commit(Case with { Requirements = Case.Requirements with { Point = new Complex(point.Real, Math.Abs(point.Imaginary)) }, Lead = choice.Lead, Slow = choice.Slow }, what, null);
    }

    /// <summary>Puts the target back at the requirement corner. False when there is no corner to go back to.</summary>
    public bool SnapToCorner()
    {
        if (Case.Requirements.Point is null)
        {
            Status = "The target is already at the requirement corner.";
            return false;
        }

        var corner = Case.Requirements with { Point = null };
        if (!TargetSelector.Select(corner).IsSuccess && DesignWorkflow.KindOf(Case.CompensatorType) is not (CompensatorKind.Lag or CompensatorKind.PI))
        {
            Status = "No requirement corner: the requirements alone do not fix a target (give overshoot and settling time, or ζ and ωn).";
            return false;
        }

        return Commit(Case with { Requirements = corner }, "snap target to the requirement corner", null);
    }

    /// <summary>Steps through the compensator kinds (lead, lag, lead-lag, PD, PI, PID).</summary>
    public void CycleKind(int step)
    {
        var kinds = DesignWorkflow.SupportedTypes;
        var index = Math.Max(0, kinds.ToList().IndexOf(Case.CompensatorType));
        var next = kinds[(((index + step) % kinds.Count) + kinds.Count) % kinds.Count];
        Commit(Case with { CompensatorType = next }, $"compensator {next}", null);
    }

    /// <summary>Steps through the lead placements.</summary>
    public void CyclePlacement(int step)
    {
        var all = Enum.GetValues<LeadPlacement>();
        var index = Array.IndexOf(all, Case.Lead.Placement);
        var next = all[(((index + step) % all.Length) + all.Length) % all.Length];
        Commit(Case with { Lead = Case.Lead with { Placement = next } }, $"placement {PlacementNames.NameOf(next)}", null);
    }

    /// <summary>Adds or removes the reference prefilter (one undo step).</summary>
    public void TogglePrefilter() =>
        Commit(Case with { Prefilter = !Case.Prefilter }, Case.Prefilter ? "reference prefilter off" : "reference prefilter on", null);

    /// <summary>Undoes the last change. False when there is none.</summary>
    public bool Undo()
    {
        if (undo.Count == 0)
        {
            Status = "Nothing to undo.";
            return false;
        }

        var change = undo[^1];
        undo.RemoveAt(undo.Count - 1);
        redo.Add(new Change(Case, change.What, null));
        Replace(change.Before);
        Status = Latest.IsSuccess ? $"undid: {change.What}" : $"undid: {change.What}; {Status}";
        return true;
    }

    /// <summary>Redoes the last undone change. False when there is none.</summary>
    public bool Redo()
    {
        if (redo.Count == 0)
        {
            Status = "Nothing to redo.";
            return false;
        }

        var change = redo[^1];
        redo.RemoveAt(redo.Count - 1);
        undo.Add(new Change(Case, change.What, null));
        Replace(change.Before);
        Status = Latest.IsSuccess ? $"redid: {change.What}" : $"redid: {change.What}; {Status}";
        return true;
    }

    /// <summary>Takes the result of a sweep; ignored when the design has changed since it started.</summary>
    public bool AcceptSweep(int revision, Outcome<RobustnessReport> result)
    {
        ArgumentNullException.ThrowIfNull(result);
        if (revision != Revision)
        {
            return false;
        }

        Robustness = result.Value;
        RobustnessProblem = result.Problem;
        return true;
    }

    /// <summary>
    /// Saves the case atomically (temporary file, flush, rename) to <paramref name="path"/> or to <see cref="Path"/>.
    /// Returns a problem when the file cannot be written; the old file is then intact.
    /// </summary>
    public Problem? Save(string? path = null, Action? beforeRename = null)
    {
        var target = path ?? Path ?? throw new InvalidOperationException("A new case needs a path to be saved to.");
        if (string.IsNullOrWhiteSpace(target) || target.IndexOfAny(System.IO.Path.GetInvalidPathChars()) >= 0 || Directory.Exists(target))
        {
            Status = "not saved: no file name";
            return new Problem($"'{target}' is not a file name to save to", "Type a file name such as case.toml (a folder before it must exist).");
        }

        var text = caseText;
        try
        {
            // Only the case file that was opened is written through a link (to its target, keeping the link).
            var opened = Path is not null && System.IO.Path.GetFullPath(target) == Path;
            AtomicFile.Write(target, text, beforeRename, followLink: opened);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            Status = $"not saved: {e.Message}";
            return new Problem($"Cannot write {target}: {e.Message}", "Check the folder exists and is writable, or save under another name.");
        }

        lock (autosaveLock)
        {
            var previousAutosave = AutosavePath;
            Path = System.IO.Path.GetFullPath(target);
            savedText = text;
            if (ownsAutosave)
            {
                // The saved file now holds this work: its autosave is no longer needed.
                AutosaveFiles.Delete(previousAutosave);
                ownsAutosave = false;
            }
        }

        Status = $"saved {System.IO.Path.GetFileName(target)}";
        return null;
    }

    /// <summary>
    /// Writes the autosave (atomically) when there is unsaved work, and removes an autosave this session wrote
    /// when there is none any more; never touches an autosave it did not write. Safe to call from a signal
    /// handler's thread. Returns a problem on an I/O failure.
    /// </summary>
    public Problem? Autosave()
    {
        lock (autosaveLock)
        {
            var file = AutosavePath;
            try
            {
                if (IsDirty)
                {
                    AtomicFile.Write(file, caseText);
                    ownsAutosave = true;
                }
                else if (ownsAutosave)
                {
                    AutosaveFiles.Delete(file);
                    ownsAutosave = false;
                }

                return null;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                return new Problem($"Cannot write the autosave {file}: {e.Message}", "Save the case somewhere writable.");
            }
        }
    }

    /// <summary>Removes this session's autosave (the user chose to discard the unsaved work).</summary>
    public void DiscardAutosave()
    {
        lock (autosaveLock)
        {
            if (ownsAutosave)
            {
                AutosaveFiles.Delete(AutosavePath);
                ownsAutosave = false;
            }
        }
    }

    /// <summary>Takes over an autosave found at start (restored or discarded by the user): it is this session's from now on.</summary>
    public void AdoptAutosave()
    {
        lock (autosaveLock)
        {
            ownsAutosave = true;
        }
    }

    /// <summary>Replaces the case with another (e.g. a restored autosave) as one undoable change.</summary>
    public void ReplaceCase(CaseFile next, string what)
    {
        ArgumentNullException.ThrowIfNull(next);
        Commit(next, what, null);
    }

    private bool Commit(CaseFile next, string what, string? coalesceKey)
    {
        var nextText = CaseFileWriter.Write(next);
        if (nextText == caseText)
        {
            Status = "no change";
            return Latest.IsSuccess;
        }

        if (coalesceKey is not null && undo.Count > 0 && undo[^1].CoalesceKey == coalesceKey && redo.Count == 0)
        {
            // Keystrokes in one field are one change: keep the state from before the first of them.
        }
        else
        {
            undo.Add(new Change(Case, what, coalesceKey));
            if (undo.Count > UndoDepth)
            {
                undo.RemoveAt(0);
            }
        }

        redo.Clear();
        Replace(next, nextText);
        if (Latest.IsSuccess)
        {
            Status = what;
        }

        return Latest.IsSuccess;
    }

    private void Replace(CaseFile next, string? text = null)
    {
        Case = next;
        caseText = text ?? CaseFileWriter.Write(next);
        Revision++;
        Latest = Redesign(next);
        Robustness = null;
        RobustnessProblem = null;
        if (Latest.Report is { } report)
        {
            LastGood = report;
        }

        CurrentTarget = TargetOf(next, Latest, CurrentTarget);
        if (next.Requirements.Point is null && CurrentTarget is { } corner && corner.Magnitude > 0)
        {
            MotionScale = corner.Magnitude;
        }
        Status = Latest.IsSuccess ? Status : "refused: " + Reason(Latest);
    }

    private static string Reason(DesignRun run) =>
        run.FieldError is { } fe ? $"{fe.Field}: {fe.Error.Message}" : run.Problem?.ToString() ?? "no design";

    private static DesignRun Redesign(CaseFile c) => DesignWorkflow.Run(c with { Variations = [] });

    private static Complex? TargetOf(CaseFile c, DesignRun run, Complex? previous)
    {
        if (c.Requirements.Point is { } p)
        {
            return p;
        }

        if (run.Report is { } report)
        {
            return report.Selection.Target.Point;
        }

        var selection = TargetSelector.Select(c.Requirements);
        return selection.IsSuccess ? selection.Value.Target.Point : previous;
    }

    private sealed record Change(CaseFile Before, string What, string? CoalesceKey);
}
