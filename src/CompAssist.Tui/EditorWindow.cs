using System.Globalization;
using System.Numerics;
using System.Text;
using CompAssist.Core.Cases;
using CompAssist.Core.Common;
using CompAssist.Core.Discrete;
using CompAssist.Core.Editing;
using CompAssist.Core.Export;
using CompAssist.Core.Model;
using CompAssist.Core.Pictures;
using CompAssist.Core.Proof;
using CompAssist.Core.Reporting;
using CompAssist.Core.Synthesis;
using CompAssist.Core.Workflow;
using CompAssist.Tui.Views;
using Terminal.Gui.App;
using Terminal.Gui.Input;
using Terminal.Gui.ViewBase;
using Terminal.Gui.Views;

namespace CompAssist.Tui;

/// <summary>
/// The editor's one screen. Left: the case as fields (loop, requirements, compensator). Right: the s-plane
/// picture and the step strip. Below: the compensator, the proof digest, a message line and the keys of the
/// moment. Help, the full report and the hand-off open as pages over it; questions appear on the message line.
/// Everything is driven by keys; no mouse is needed.
/// </summary>
internal sealed class EditorWindow : Runnable
{
    /// <summary>Width of the form column.</summary>
    public const int FormWidth = 36;

    private const int BottomRows = 5;
    private static readonly TimeSpan AutosaveInterval = TimeSpan.FromSeconds(1);

    private readonly Palette palette;
    private readonly ISweepRunner? sweeps;
    private readonly HandoffWriter? handoffWriter;
    private readonly List<FieldBox> fields = [];
    private readonly List<EditorKey> keys = [];
    private readonly Label bar = new() { X = 0, Y = 0, Height = 1 };
    private readonly List<(Label Label, int Row)> headings = [];
    private readonly Label loopHeading;
    private readonly Label compensatorLine = new() { X = 0, Width = FormWidth, Height = 1 };
    private readonly Label errorCaret = new() { X = 0, Width = FormWidth, Height = 1, Visible = false };
    private readonly Label errorMessage = new() { X = 0, Width = FormWidth, Height = 1, Visible = false };
    private readonly Label planeHeading = new() { X = FormWidth + 1, Y = 1, Height = 1 };
    private readonly Label stepHeading = new() { X = FormWidth + 1, Height = 1 };
    private readonly PlanePreview plane;
    private readonly StepPreview step;
    private readonly Label designLine = new() { X = 0, Height = 1 };
    private readonly DigestView digest;
    private readonly Label message = new() { X = 0, Height = 1 };
    private readonly Label hints = new() { X = 0, Height = 1 };
    private readonly TextField promptBox = new() { Visible = false, Height = 1 };
    private readonly TextPage page;
    private CancellationTokenSource? sweepCancel;
    private DesignSession? sweepSession;
    private int sweepRevision = -1;
    private string? sweepNote;
    private CancellationTokenSource? searchCancel;
    private Core.Search.SearchOutcome? searched;
    private bool refreshingFields;
    private Prompt? prompt;
    private HandoffOptions handoffOptions = new();
    private int lastAutosavedRevision = -1;
    private string? formSignature;

    /// <summary>Builds the screen over a session.</summary>
    public EditorWindow(DesignSession session, Palette palette, ISweepRunner? sweeps, HandoffWriter? handoffWriter, PictureStyle style)
    {
        Session = session;
        this.palette = palette;
        this.sweeps = sweeps;
        this.handoffWriter = handoffWriter;
        plane = new PlanePreview(palette) { X = FormWidth + 1, Y = 2, Style = style };
        step = new StepPreview(palette) { X = FormWidth + 1, Style = style };
        digest = new DigestView(palette) { X = 0, Height = 2 };
        page = new TextPage(palette) { X = 0, Y = 0, Width = Dim.Fill(), Height = Dim.Fill() };
        Width = Dim.Fill();
        Height = Dim.Fill();
        SetScheme(palette.Scheme);

        loopHeading = Heading("Loop", 1);
        AddField(CaseField.Plant, "G(s)", 2, 0, 6, FormWidth - 6);
        AddField(CaseField.Feedback, "H(s)", 3, 0, 6, FormWidth - 6);
        AddField(CaseField.Sign, "sign", 4, 0, 6, 4);
        AddField(CaseField.PadeOrder, "Padé order", 4, 12, 11, 4);
        Heading("Requirements", 5);
        AddField(CaseField.Overshoot, "OS %", 6, 0, 6, 10);
        AddField(CaseField.SettlingTime, "ts s", 6, 18, 6, 12);
        AddField(CaseField.Band, "band", 7, 0, 6, 10);
        AddField(CaseField.PeakTime, "tp s", 7, 18, 6, 12);
        AddField(CaseField.Zeta, "ζ", 8, 0, 6, 10);
        AddField(CaseField.NaturalFrequency, "ωn", 8, 18, 6, 12);
        AddField(CaseField.RiseTime, "tr s", 9, 0, 6, 10);
        AddField(CaseField.MaxSensitivity, "Ms", 9, 18, 6, 12);
        AddField(CaseField.MinPhaseMargin, "PM °", 10, 0, 6, 10);
        AddField(CaseField.MinGainMargin, "GM dB", 10, 18, 6, 12);
        AddField(CaseField.MinDelayMargin, "DM s", 11, 0, 6, 10);
        AddField(CaseField.ActuatorLimit, "|u| ≤", 11, 18, 6, 12);
        AddField(CaseField.ErrorConstant, "steady", 12, 0, 8, FormWidth - 8);
        AddField(CaseField.Variations, "vary", 13, 0, 8, FormWidth - 8);
        Heading("Compensator (F3 kind, F4 place)", 14);
        AddField(CaseField.PlacementValue, "value", 16, 0, 12, FormWidth - 12);
        Add(bar, compensatorLine, errorCaret, errorMessage, planeHeading, plane, stepHeading, step, designLine, digest, message, hints, promptBox, page);
        BuildKeys();
        PlaceFixedViews();
        LayoutScreen();
        RefreshAll(reframe: true, refreshFields: true);
        Initialized += (_, _) => FocusStart();
    }

    /// <summary>Puts the focus where work starts: the picture when there is a design to move, else the plant field.</summary>
    internal void FocusStart()
    {
        if (Session.LastGood is not null)
        {
            plane.SetFocus();
        }
        else
        {
            BoxOf(CaseField.Plant).SetFocus();
        }

        RefreshChrome();
    }

    /// <summary>The session being edited.</summary>
    public DesignSession Session { get; private set; }

    /// <summary>Every key the editor knows (the help page lists exactly these).</summary>
    public IReadOnlyList<EditorKey> Keys => keys;

    /// <summary>The page open over the screen ("help", "report", "handoff"), or empty.</summary>
    public string OpenPage => page.Visible ? page.Kind : string.Empty;

    /// <summary>The text of the open page (unwrapped), or empty.</summary>
    public string PageText => page.Visible ? page.Content : string.Empty;

    /// <summary>The question on the message line, or null.</summary>
    public string? PromptText => prompt?.Question;

    /// <summary>The s-plane picture as last drawn.</summary>
    public string PlanePicture => plane.LastPicture;

    /// <summary>The proof digest as last drawn.</summary>
    public string DigestText => digest.LastText;

    /// <summary>The message line's text.</summary>
    public string Message => message.Text;

    /// <summary>The picture's text box (focus target of F2).</summary>
    internal PlanePreview Plane => plane;

    /// <summary>The text box of a field.</summary>
    internal TextField BoxOf(CaseField field) => fields.First(f => f.Field == field).Box;

    /// <summary>The error a field shows, or null.</summary>
    internal Core.Parsing.ParseError? ErrorOf(CaseField field) => fields.First(f => f.Field == field).Error;

    /// <summary>Called by the application-wide key hook: handles the key if it is one of the editor's.</summary>
    public bool HandleKey(Key key)
    {
        if (prompt is not null)
        {
            return HandlePromptKey(key);
        }

        if (page.Visible)
        {
            return HandlePageKey(key);
        }

        foreach (var k in keys)
        {
            if (k.Scope == KeyScope.Handoff || (k.Scope == KeyScope.SPlane && !plane.HasFocus))
            {
                continue;
            }

            if (k.Keys.Any(candidate => candidate == key))
            {
                k.Action(key);
                return true;
            }
        }

        return false;
    }

    /// <summary>Writes the autosave if anything changed since the last one (called by a timer).</summary>
    public void AutosaveNow()
    {
        if (WorkDiscarded || Session.Revision == lastAutosavedRevision)
        {
            return;
        }

        var problem = Session.Autosave();
        if (problem is not null)
        {
            Say(problem.ToString());
        }

        lastAutosavedRevision = Session.Revision;
    }

    /// <summary>
    /// The last line of defence for an unexpected exception in a key handler: the work is autosaved and the
    /// error shown on the message line; the editor goes on.
    /// </summary>
    public bool ReportCrash(Exception error)
    {
        ArgumentNullException.ThrowIfNull(error);
        Session.Autosave();
        prompt = null;
        promptBox.Visible = false;
        Say($"internal error ({error.GetType().Name}: {error.Message}); your work is autosaved. Please report it.");
        return true;
    }

    /// <summary>
    /// Writes the autosave from a signal handler's thread: only the file, from the immutable case as it stands
    /// (no screen update, which belongs to the UI thread).
    /// </summary>
    public void AutosaveFromSignal()
    {
        if (!WorkDiscarded)
        {
            Session.Autosave();
        }
    }

    /// <summary>Starts the autosave timer (real runs; tests call <see cref="AutosaveNow"/>).</summary>
    public void StartAutosave(IApplication app, TimeSpan? interval = null)
    {
        ArgumentNullException.ThrowIfNull(app);
        app.AddTimeout(interval ?? AutosaveInterval, () =>
        {
            AutosaveNow();
            return true;
        });
    }

    /// <summary>Asks whether to restore an autosave found at start.</summary>
    public void OfferAutosave(string autosavePath)
    {
        var (restored, error) = CaseFileReader.ReadFile(autosavePath);
        if (restored is null)
        {
            Say($"An autosave exists but cannot be read ({error?.Message}); it is left as it is: {autosavePath}");
            return;
        }

        if (CaseFileWriter.Write(restored) == CaseFileWriter.Write(Session.Case))
        {
            AutosaveFiles.Delete(autosavePath);
            return;
        }

        var when = File.GetLastWriteTime(autosavePath).ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);
        Ask(
            $"Autosaved work from {when}: r restore · d discard · Esc keep aside",
            new Dictionary<Rune, Action>
            {
                [new Rune('r')] = () =>
                {
                    Session.ReplaceCase(restored, "restore the autosave");
                    Session.AdoptAutosave();
                    RefreshAll(reframe: true, refreshFields: true);
                    Say("Restored the autosave; save with Ctrl+S to keep it.");
                },
                [new Rune('d')] = () =>
                {
                    AutosaveFiles.Delete(autosavePath);
                    Say("Autosave discarded.");
                },
            },
            onCancel: () =>
            {
                // Nothing is lost: the old work moves aside, so this session's own autosave cannot overwrite it.
                var aside = AutosaveFiles.KeepAside(autosavePath, DateTime.Now);
                Say(aside is null ? $"The autosave could not be moved aside; it stays at {autosavePath}." : $"The autosave is kept as {Path.GetFileName(aside)} (a case file: open it with Ctrl+O).");
            });
    }

    private Label Heading(string text, int row)
    {
        var label = new Label { Text = text, X = 0, Width = FormWidth, Height = 1 };
        headings.Add((label, row));
        Add(label);
        return label;
    }

    private void AddField(CaseField field, string label, int row, int labelX, int labelWidth, int boxWidth)
    {
        var box = new FieldBox(field, label, row, labelX, labelWidth, boxWidth);
        fields.Add(box);
        box.Box.TextChanged += (_, _) => OnFieldTyped(box);
        box.Box.HasFocusChanged += (_, _) => OnFocusMoved();
        Add(box.Label, box.Box);
    }

    private void BuildKeys()
    {
        void K(KeyScope scope, string label, string what, Action action, params Key[] triggers) => keys.Add(new EditorKey(triggers, label, scope, what, _ => action()));

        K(KeyScope.Anywhere, "F1", "this list of keys", ShowHelp, Key.F1);
        K(KeyScope.Anywhere, "F2", "go to the s-plane picture (arrow keys then move the target)", () => { plane.SetFocus(); RefreshChrome(); }, Key.F2);
        K(KeyScope.Anywhere, "F3 / Shift+F3", "next / previous compensator kind", () => Act(() => Session.CycleKind(1), reframe: false), Key.F3);
        K(KeyScope.Anywhere, "", "previous compensator kind", () => Act(() => Session.CycleKind(-1), reframe: false), Key.F3.WithShift);
        K(KeyScope.Anywhere, "F4 / Shift+F4", "next / previous lead placement", () => Act(() => Session.CyclePlacement(1), reframe: false, refreshFields: true), Key.F4);
        K(KeyScope.Anywhere, "", "previous lead placement", () => Act(() => Session.CyclePlacement(-1), reframe: false, refreshFields: true), Key.F4.WithShift);
        K(KeyScope.Anywhere, "F5", "type the target point exactly", AskTarget, Key.F5);
        K(KeyScope.Anywhere, "F7", "the full design report with its proof", ShowReport, Key.F7);
        K(KeyScope.Anywhere, "F8", "hand-off: discretize, re-prove, export for firmware", ShowHandoff, Key.F8);
        K(KeyScope.Anywhere, "F9", "search the region for a design whose simulated loop meets every requirement (in the background; then take the winner or a runner-up)", StartSearch, Key.F9);
        K(KeyScope.Anywhere, "Ctrl+Z", "undo the last change", () => Act(() => Session.Undo(), reframe: false, refreshFields: true), Key.Z.WithCtrl);
        K(KeyScope.Anywhere, "Ctrl+Y", "redo", () => Act(() => Session.Redo(), reframe: false, refreshFields: true), Key.Y.WithCtrl);
        K(KeyScope.Anywhere, "Ctrl+S / F10", "save the case (asks for a name the first time)", () => Save(null), Key.S.WithCtrl, Key.F10);
        K(KeyScope.Anywhere, "Ctrl+O", "open another case file", AskOpen, Key.O.WithCtrl);
        K(KeyScope.Anywhere, "Ctrl+Q / Esc", "quit (asks first when work is unsaved)", RequestQuit, Key.Q.WithCtrl, Key.Esc);
        keys.Add(new EditorKey(
            [Key.CursorLeft, Key.CursorRight, Key.CursorUp, Key.CursorDown, Key.CursorLeft.WithShift, Key.CursorRight.WithShift, Key.CursorUp.WithShift, Key.CursorDown.WithShift],
            "← → ↑ ↓",
            KeyScope.SPlane,
            "move the target (σ/ωd mode: σ and ωd; ζ/ωn mode: ωn and ζ); with Shift one fine step",
            MoveTarget));
        K(KeyScope.SPlane, "f", "toggle coarse / fine steps", () => { Session.ToggleSize(); RefreshChrome(); }, Key.F);
        K(KeyScope.SPlane, "m", "toggle σ/ωd moves and ζ/ωn moves (along constant ζ or constant ωn)", () => { Session.ToggleMode(); RefreshChrome(); }, Key.M);
        K(KeyScope.SPlane, "c", "put the target back at the requirement corner", () => Act(() => Session.SnapToCorner(), reframe: true), Key.C);
        K(KeyScope.SPlane, "t / Enter", "type the target point exactly", AskTarget, Key.T, Key.Enter);
        K(KeyScope.SPlane, "u / r", "undo / redo", () => Act(() => Session.Undo(), reframe: false, refreshFields: true), Key.U);
        K(KeyScope.SPlane, "", "redo", () => Act(() => Session.Redo(), reframe: false, refreshFields: true), Key.R);
        K(KeyScope.SPlane, "k / K", "next / previous compensator kind", () => Act(() => Session.CycleKind(1), reframe: false), Key.K);
        K(KeyScope.SPlane, "", "previous compensator kind", () => Act(() => Session.CycleKind(-1), reframe: false), Key.K.WithShift);
        K(KeyScope.SPlane, "p / P", "next / previous lead placement", () => Act(() => Session.CyclePlacement(1), reframe: false, refreshFields: true), Key.P);
        K(KeyScope.SPlane, "", "previous lead placement", () => Act(() => Session.CyclePlacement(-1), reframe: false, refreshFields: true), Key.P.WithShift);
        K(KeyScope.SPlane, "+ / -", "zoom the picture in / out", () => plane.Zoom(1.5), new Key('+'), new Key('='));
        K(KeyScope.SPlane, "", "zoom out", () => plane.Zoom(1 / 1.5), new Key('-'));
        K(KeyScope.SPlane, "s", "search the region (as F9)", StartSearch, Key.S);
        K(KeyScope.SPlane, "0", "frame the picture around the target again", () => RefreshAll(reframe: true, refreshFields: false), Key.D0);
        K(KeyScope.SPlane, "a", "toggle plain ASCII / Unicode pictures", ToggleStyle, Key.A);
        K(KeyScope.SPlane, "g", "reference prefilter on / off (cancels the compensator zeros near the target; F7 shows the step with it)", () => Act(() => Session.TogglePrefilter(), reframe: false), Key.G);
        K(KeyScope.SPlane, "?", "this list of keys", ShowHelp, new Key('?'));
        K(KeyScope.Handoff, "m", "next discretization method", () => CycleHandoff(method: 1), Key.M);
        K(KeyScope.Handoff, "n", "next number format (double, float, fixed16, fixed24, fixed32)", () => CycleHandoff(format: 1), Key.N);
        K(KeyScope.Handoff, "t", "type the sample time (empty: recommended)", AskSampleTime, Key.T);
        K(KeyScope.Handoff, "d", "one sample of computation delay in the sampled proof, on / off", () => { handoffOptions = handoffOptions with { ComputationDelay = !handoffOptions.ComputationDelay }; page.Refresh(HandoffText()); }, Key.D);
        K(KeyScope.Handoff, "a", "anti-windup of the exported PID: clamping, back-calculation, none", CycleAntiWindup, Key.A);
        K(KeyScope.Handoff, "e", "derivative of the exported PID on the measurement / on the error", () => { handoffOptions = handoffOptions with { DerivativeOnError = !handoffOptions.DerivativeOnError }; page.Refresh(HandoffText()); }, Key.E);
        K(KeyScope.Handoff, "w", "write the package (C, JSON, CSV vectors, report, plots)", AskHandoffFolder, Key.W);
    }

    private void MoveTarget(Key key)
    {
        var bare = key.NoShift;
        var direction = bare == Key.CursorLeft ? MoveDirection.Left
            : bare == Key.CursorRight ? MoveDirection.Right
            : bare == Key.CursorUp ? MoveDirection.Up
            : MoveDirection.Down;
        Act(() => Session.MoveTarget(direction, key.IsShift ? StepSize.Fine : null), reframe: false);
    }

    /// <summary>Times key presses to frames when the benchmarks ask for it (see <see cref="FrameTimer"/>).</summary>
    internal FrameTimer? Timer { get; set; }

    /// <summary>The application-wide key hook (installed by the launcher and the tests).</summary>
    public void OnApplicationKey(object? sender, Key key)
    {
        ArgumentNullException.ThrowIfNull(key);
        if (HandleKey(key))
        {
            key.Handled = true;
            Timer?.KeyHandled();
        }
    }

    // A change through the session, then everything it shows redone and its status said.
    private void Act(Action change, bool reframe, bool refreshFields = false)
    {
        change();
        RefreshAll(reframe, refreshFields);
        Say(Session.Status);
    }

    private void OnFieldTyped(FieldBox box)
    {
        if (refreshingFields)
        {
            return;
        }

        var error = Session.Edit(box.Field, box.Box.Text ?? string.Empty);
        box.Error = error;
        if (error is null)
        {
            var loopField = box.Field is CaseField.Plant or CaseField.Feedback or CaseField.Sign or CaseField.PadeOrder;
            RefreshAll(reframe: loopField || CaseFieldText.CornerFields.Contains(box.Field), refreshFields: false);
            Say(Session.Status);
        }
        else
        {
            Say($"{FieldNames.Of(box.Field)}: {error.Message}. {error.Hint}");
        }

        LayoutScreen();
    }

    private void OnFocusMoved()
    {
        LayoutScreen();
        RefreshChrome();
    }

    // Views whose place never changes: set once (setting a Pos or Dim invalidates the layout).
    private void PlaceFixedViews()
    {
        var bottom = Pos.AnchorEnd(BottomRows);
        bar.Width = Dim.Fill();
        planeHeading.Width = Dim.Fill();
        plane.Width = Dim.Fill();
        plane.Height = Dim.Fill(BottomRows + 5);
        stepHeading.Y = Pos.Bottom(plane);
        stepHeading.Width = Dim.Fill();
        step.Y = Pos.Bottom(stepHeading);
        step.Width = Dim.Fill();
        step.Height = 4;
        designLine.Y = bottom;
        designLine.Width = Dim.Fill();
        digest.Y = Pos.AnchorEnd(BottomRows - 1);
        digest.Width = Dim.Fill();
        message.Y = Pos.AnchorEnd(2);
        message.Width = Dim.Fill();
        promptBox.Y = Pos.AnchorEnd(2);
        hints.Y = Pos.AnchorEnd(1);
        hints.Width = Dim.Fill();
    }

    // The form: rows below a field that shows an error move down by the two error rows. Only redone when
    // what it depends on changed, so that a target move does not lay the whole screen out again.
    private void LayoutScreen()
    {
        var focused = fields.FirstOrDefault(f => f.Box.HasFocus && f.Error is not null);
        var placementVisible = CaseFieldText.PlacementValueMeaning(Session.Case.Lead.Placement) is not null && Session.Case.CompensatorType is "lead" or "lead-lag";
        var signature = $"{focused?.Field}|{focused?.Error}|{placementVisible}|{PlacementValueLabel()}|{string.Concat(fields.Select(f => f.Error is null ? '.' : '!'))}";
        if (signature == formSignature)
        {
            return;
        }

        formSignature = signature;
        var shiftFrom = focused?.Row ?? int.MaxValue;
        int RowOf(int row) => row > shiftFrom ? row + 2 : row;
        foreach (var (label, row) in headings)
        {
            label.Y = RowOf(row);
        }

        foreach (var f in fields)
        {
            f.Label.Y = RowOf(f.Row);
            f.Box.Y = RowOf(f.Row);
            var text = f.Field == CaseField.PlacementValue ? PlacementValueLabel() : f.BaseLabel;
            f.Label.Text = text + (f.Error is not null ? "!" : string.Empty);
            if (f.Field == CaseField.PlacementValue)
            {
                // Only the fixed-zero, fixed-pole, ratio and cancel placements take a value.
                f.Box.Visible = placementVisible;
            }
        }

        compensatorLine.Y = RowOf(15);
        if (focused?.Error is { } e)
        {
            var caretColumn = Math.Clamp(focused.BoxX + e.Index, 0, FormWidth - 1);
            errorCaret.Y = focused.Row + 1;
            errorCaret.Text = new string(' ', caretColumn) + new string('^', Math.Clamp(e.Length, 1, FormWidth - caretColumn));
            errorMessage.Y = focused.Row + 2;
            errorMessage.Text = TextPage.Fit(e.Message, FormWidth);
            errorCaret.Visible = true;
            errorMessage.Visible = true;
        }
        else
        {
            errorCaret.Visible = false;
            errorMessage.Visible = false;
        }

        SetNeedsLayout();
    }

    private static void SetText(View view, string text)
    {
        if (view.Text != text)
        {
            view.Text = text;
        }
    }

    private string PlacementValueLabel() => CaseFieldText.PlacementValueMeaning(Session.Case.Lead.Placement) ?? string.Empty;

    private void RefreshAll(bool reframe, bool refreshFields)
    {
        if (refreshFields)
        {
            refreshingFields = true;
            foreach (var f in fields)
            {
                var text = CaseFieldText.Of(Session.Case, f.Field);
                if ((f.Box.Text ?? string.Empty) != text)
                {
                    f.Box.Text = text;
                }

                f.Error = null;
            }

            refreshingFields = false;
        }

        var shown = Session.Latest.Report ?? Session.LastGood;
        if (shown is not null)
        {
            var target = Session.CurrentTarget;
            var scene = new SPlaneScene
            {
                Branches = LocusReport.Polylines(shown.Locus),
                Poles = shown.Locus.Poles,
                Zeros = shown.Locus.Zeros,
                ClosedLoopPoles = [.. shown.Proof.Roots.Select(r => r.Value)],
                Target = target,
                ZetaGuide = target is { } t1 && t1.Magnitude > 0 ? -t1.Real / t1.Magnitude : null,
                NaturalFrequencyGuide = target?.Magnitude,
            };
            plane.Show(scene, shown.Locus.Poles.Concat(shown.Locus.Zeros).Concat(shown.Proof.Roots.Select(r => r.Value)), reframe);
            step.Show(shown.Check.Output, shown.Check.Step.FinalValue);
        }
        else
        {
            plane.Show(new SPlaneScene { Target = Session.CurrentTarget }, Session.CurrentTarget is { } only ? [only] : [], reframe);
            step.Show(null, 0);
        }

        StartSweep();
        RefreshChrome();
        LayoutScreen();
    }

    private void RefreshChrome()
    {
        var s = Session;
        var name = s.Path is null ? "new case" : Path.GetFileName(s.Path);
        var dirty = s.IsDirty ? " ● unsaved" : string.Empty;
        var kind = s.Case.CompensatorType;
        var placement = kind is "lead" or "lead-lag" ? " · " + PlacementNames.NameOf(s.Case.Lead.Placement) : string.Empty;
        var mode = s.Mode == MotionMode.RealImaginary ? "σ/ωd" : "ζ/ωn";
        var size = s.Size == StepSize.Coarse ? "coarse" : "fine";
        var stepLength = TransferFunctionFormatter.Number(TargetMotion.LengthStep(s.MotionScale, s.Size), 3);
        var full = $" CompAssist │ {name}{dirty} │ {kind}{placement} │ {mode} {size} {stepLength} │ F1 keys";
        var columns = Frame.Width > 0 ? Frame.Width : 80;
        SetText(bar, full.Length <= columns ? full : $" {name}{dirty} │ {kind}{placement} │ {mode} {size} {stepLength} │ F1 keys");
        SetText(compensatorLine, TextPage.Fit($"kind {kind}{(placement.Length > 0 ? "  placement " + PlacementNames.NameOf(s.Case.Lead.Placement) : string.Empty)}", FormWidth));

        var delay = (s.Latest.Report ?? s.LastGood)?.Design.Loop.Delay ?? 0.0;
        SetText(loopHeading, delay > 0 ? TextPage.Fit($"Loop  delay {TransferFunctionFormatter.Number(delay, 4)} s, roots: Padé {s.Case.PadeOrder}", FormWidth) : "Loop");

        var target = s.CurrentTarget;
        SetText(planeHeading, target is { } t
            ? $"{(plane.HasFocus ? "▶" : " ")}s* {TransferFunctionFormatter.Number(t.Real, 4)} ± {TransferFunctionFormatter.Number(t.Imaginary, 4)}j  ζ {TransferFunctionFormatter.Number(t.Magnitude > 0 ? -t.Real / t.Magnitude : 1, 3)}  ωn {TransferFunctionFormatter.Number(t.Magnitude, 4)}"
            : " s-plane (no target yet)");
        SetText(stepHeading, s.Latest.IsSuccess || s.LastGood is null ? "step (closed loop, unit reference)" : "step of the LAST GOOD design");

        if (s.Latest.Report is { } report)
        {
            SetText(designLine, $"C(s) = {report.Design.Compensator.TransferFunction}");
            digest.Show(ProofDigest.Of(report, s.Robustness, sweepNote));
        }
        else
        {
            var why = s.Latest.FieldError is { } fe ? $"{FieldNames.Of(FieldOf(fe.Field))}: {fe.Error.Message}" : s.Latest.Problem?.ToString() ?? "no design";
            SetText(designLine, s.LastGood is { } good ? $"last good C(s) = {good.Design.Compensator.TransferFunction}" : "no design yet");
            if (s.Case.Plant is null)
            {
                digest.Show([new DigestItem("then the requirements (OS % and ts s, or ζ and ωn); the design follows as you type", null)], "Type the plant G(s) to begin, e.g. 10/(s(s+2)).");
            }
            else
            {
                digest.Show([new DigestItem(why, false)], s.LastGood is null ? "No design yet:" : "REFUSED at this target; the last good design is kept:");
            }
        }

        SetText(hints, plane.HasFocus
            ? " ←↑↓→ move  f fine  m ζ/ωn  c corner  t type  u undo  k kind  Tab fields  F1"
            : " Tab field  F2 s-plane  ^Z undo  ^S save  F7 report  F8 hand-off  ^Q quit  F1");
    }

    private static CaseField FieldOf(string name) => name == "feedback" ? CaseField.Feedback : CaseField.Plant;

    private void StartSweep()
    {
        if (Session.PendingSweep is not { } request || sweeps is null)
        {
            // Nothing to sweep for this design (refused, no variations, or done): stop a sweep still running.
            CancelSweep();
            if (Session.Robustness is not null || Session.Case.Variations.IsEmpty || !Session.Latest.IsSuccess)
            {
                sweepNote = null;
            }

            return;
        }

        if (ReferenceEquals(sweepSession, Session) && sweepRevision == request.Revision && sweepCancel is not null)
        {
            return; // already running for this very design
        }

        CancelSweep();
        sweepCancel = new CancellationTokenSource();
        sweepSession = Session;
        sweepRevision = request.Revision;
        var token = sweepCancel.Token;
        var owner = Session;
        sweepNote = $"robustness 0/{request.Corners}…";
        sweeps.Start(
            request,
            done =>
            {
                if (ReferenceEquals(owner, Session) && !token.IsCancellationRequested)
                {
                    sweepNote = $"robustness {done}/{request.Corners}…";
                    RefreshChrome();
                }
            },
            result =>
            {
                if (ReferenceEquals(owner, Session) && !token.IsCancellationRequested && Session.AcceptSweep(request.Revision, result))
                {
                    sweepNote = result.Problem is { } p ? $"robustness: {p.Message}" : null;
                    CancelSweep();
                    RefreshChrome();
                }
            },
            token);
    }

    private void StartSearch()
    {
        if (sweeps is null)
        {
            Say("The search runs in the background, and this editor has no background runner.");
            return;
        }

        if (Session.SearchableCase() is not { } searchable)
        {
            Say("No region to search: give an overshoot bound with a settling time or a peak time.");
            return;
        }

        CancelSearch();
        searchCancel = new CancellationTokenSource();
        var owner = Session;
        Say("Searching the region in the background; keys keep working on the design on screen.");
        sweeps.StartSearch(
            (progress, token) => DesignWorkflow.Search(searchable, new Core.Search.SearchOptions { MaxParallelism = 1 }, progress, token),
            count =>
            {
                if (ReferenceEquals(owner, Session))
                {
                    Say($"Searching the region: {count} candidates so far.");
                }
            },
            run =>
            {
                if (ReferenceEquals(owner, Session))
                {
                    CancelSearch();
                    ShowSearch(run);
                }
            },
            text =>
            {
                if (ReferenceEquals(owner, Session))
                {
                    CancelSearch();
                    Say(text);
                }
            },
            searchCancel.Token);
    }

    private void ShowSearch(DesignRun run)
    {
        if (run.Report?.Search is not { } outcome)
        {
            Say(run.Problem is { } p ? $"Search: {p.Message}. {p.Hint}" : run.FieldError is { } f ? $"Search: the {f.Field} cannot be read." : "Search: nothing to show.");
            return;
        }

        searched = outcome;
        var sb = new StringBuilder();
        sb.AppendLine("Take one (its target and choices become the case; Ctrl+Z undoes it):");
        var all = new[] { outcome.Winner }.Concat(outcome.RunnersUp).ToList();
        for (var i = 0; i < all.Count; i++)
        {
            TextWrap.AppendTo(sb, $"{i + 1}  {SearchSection.CandidateLine(all[i], outcome.Objective)}", "  ", "     ");
        }

        sb.AppendLine();
        SearchSection.Append(sb, outcome);

        page.Open("search", outcome.Meets ? "Search: a design that meets every requirement" : "Search: nothing meets every requirement", sb.ToString(), $"Enter or 1 takes the winner · 2–{all.Count} a runner-up · Esc closes");
    }

    private static int? TakeIndex(Key key) =>
        key == Key.Enter || key == Key.D1 ? 0
        : key == Key.D2 ? 1
        : key == Key.D3 ? 2
        : key == Key.D4 ? 3
        : key == Key.D5 ? 4
        : key == Key.D6 ? 5
        : null;

    private void CancelSearch()
    {
        searchCancel?.Cancel();
        searchCancel?.Dispose();
        searchCancel = null;
    }

    private void CancelSweep()
    {
        sweepCancel?.Cancel();
        sweepCancel?.Dispose();
        sweepCancel = null;
        sweepSession = null;
        sweepRevision = -1;
    }

    private void Say(string text)
    {
        if (prompt is not null)
        {
            // The question stays on the message line; news goes beneath it.
            hints.Text = " " + text;
            return;
        }

        message.Text = text;
        message.Visible = true;
        SetNeedsDraw();
    }

    private void ToggleStyle()
    {
        var next = plane.Style == PictureStyle.Unicode ? PictureStyle.Ascii : PictureStyle.Unicode;
        plane.Style = next;
        step.Style = next;
        plane.SetNeedsDraw();
        step.SetNeedsDraw();
    }

    private void ShowHelp() => page.Open("help", "CompAssist keys", HelpText(), "Esc or q closes · ↑↓ PgUp PgDn scroll");

    /// <summary>The help page's text, from the key table.</summary>
    internal string HelpText()
    {
        var sb = new StringBuilder();
        sb.AppendLine("Everywhere (also while typing in a field):");
        foreach (var k in keys.Where(k => k.Scope == KeyScope.Anywhere && k.Label.Length > 0))
        {
            TextWrap.AppendTo(sb, k.What, $"  {k.Label,-16} ", new string(' ', 19), 78);
        }

        sb.AppendLine("  Tab / Shift+Tab  next / previous field or picture");
        sb.AppendLine();
        sb.AppendLine("On the s-plane picture (F2 goes there):");
        foreach (var k in keys.Where(k => k.Scope == KeyScope.SPlane && k.Label.Length > 0))
        {
            TextWrap.AppendTo(sb, k.What, $"  {k.Label,-16} ", new string(' ', 19), 78);
        }

        sb.AppendLine();
        sb.AppendLine("On the hand-off page (F8):");
        foreach (var k in keys.Where(k => k.Scope == KeyScope.Handoff && k.Label.Length > 0))
        {
            TextWrap.AppendTo(sb, k.What, $"  {k.Label,-16} ", new string(' ', 19), 78);
        }

        sb.AppendLine();
        sb.AppendLine("On any page: ↑ ↓ PgUp PgDn Home End scroll; Esc or q closes it.");
        sb.AppendLine("While the message line asks a question: the letters it names, or Esc to cancel.");
        sb.AppendLine();
        foreach (var paragraph in new[]
        {
            "Fields take effect as you type. A field the design cannot read shows ! and a caret under the problem, and the last good design stays on screen. Numbers use a dot. Editing a requirement puts the target back at the requirement corner.",
            "Picture: × open-loop poles, ○ zeros, ◆ target, ■ designed closed-loop poles, dots the locus of the compensated loop, thin lines the ζ ray and ωn arc through the target. In ASCII: x poles, o zeros, * target, # closed-loop poles.",
            $"Unsaved work is autosaved every second beside the case as NAME{AutosaveFiles.Suffix} (untitled{AutosaveFiles.Suffix} for a new case), and at once when the terminal hangs up. Opening the case again offers it back when it is newer than the case: r restores it, d discards it, Esc keeps it aside as NAME.autosave-DATE-TIME.toml.",
        })
        {
            foreach (var line in TextWrap.Lines(paragraph, 78))
            {
                sb.AppendLine(line);
            }

            sb.AppendLine();
        }
        return sb.ToString();
    }

    private void ShowReport()
    {
        var report = Session.Latest.Report ?? Session.LastGood;
        if (report is null)
        {
            Say("No design to report yet.");
            return;
        }

        var withSweep = report with { Robustness = Session.Robustness };
        var title = Session.Latest.IsSuccess ? Session.Case.Name : Session.Case.Name + " (LAST GOOD design; the current target is refused)";
        page.Open("report", "Design report (the same as `compassist design`)", DesignTextReport.Render(withSweep, title, plane.Style), "Esc or q closes · ↑↓ PgUp PgDn scroll");
    }

    private void ShowHandoff()
    {
        if (Session.Latest.Report is null)
        {
            Say("Hand-off needs a design at the current target; move the target or undo first.");
            return;
        }

        page.Open("handoff", "Hand-off to firmware", HandoffText(), "m method · n format · t sample time · d delay · a anti-windup · e derivative · w write · Esc");
    }

    private string HandoffText()
    {
        var sb = new StringBuilder();
        Cautions.AppendSection(sb, "CAUTION — read before any of this drives a machine:");

        sb.AppendLine();
        if (Session.Latest.Report is not { } report)
        {
            sb.AppendLine("No design at the current target.");
            return sb.ToString();
        }

        var package = HandoffPackage.Build(report, handoffOptions with { Name = HandoffName() }, Session.Case.Name);
        if (!package.IsSuccess)
        {
            sb.AppendLine($"Cannot hand off: {package.Problem}");
            return sb.ToString();
        }

        sb.Append(HandoffSummary.Render(package.Value, handoffOptions, report.Design.Compensator.TransferFunction));
        return sb.ToString();
    }

    private string HandoffName()
    {
        var stem = Session.Path is null ? "compassist_ctrl" : Path.GetFileNameWithoutExtension(Session.Path);
        var chars = stem.Select(c => char.IsAsciiLetterOrDigit(c) ? char.ToLowerInvariant(c) : '_').ToArray();
        var name = new string(chars);
        return name.Length == 0 || char.IsAsciiDigit(name[0]) ? "ctrl_" + name : name;
    }

    private static readonly DiscretizationMethod[] HandoffMethods =
        [DiscretizationMethod.Tustin, DiscretizationMethod.Prewarp, DiscretizationMethod.Matched, DiscretizationMethod.Zoh, DiscretizationMethod.Backward];

    private static readonly NumberFormat[] HandoffFormats =
        [NumberFormat.Double, NumberFormat.Float, NumberFormat.Fixed(16), NumberFormat.Fixed(24), NumberFormat.Fixed(32)];

    private void CycleHandoff(int method = 0, int format = 0)
    {
        if (method != 0)
        {
            var i = Array.IndexOf(HandoffMethods, handoffOptions.Method);
            handoffOptions = handoffOptions with { Method = HandoffMethods[(i + method + HandoffMethods.Length) % HandoffMethods.Length] };
        }

        if (format != 0)
        {
            var i = Array.FindIndex(HandoffFormats, f => f == handoffOptions.Format);
            handoffOptions = handoffOptions with { Format = HandoffFormats[(i + format + HandoffFormats.Length) % HandoffFormats.Length] };
        }

        page.Refresh(HandoffText());
    }

    private void CycleAntiWindup()
    {
        var all = Enum.GetValues<AntiWindup>();
        handoffOptions = handoffOptions with { AntiWindup = all[(Array.IndexOf(all, handoffOptions.AntiWindup ?? AntiWindup.Clamping) + 1) % all.Length] };
        page.Refresh(HandoffText());
    }

    private void AskSampleTime() => AskText("sample time s (empty: recommended): ", handoffOptions.SampleTime?.ToString(CultureInfo.InvariantCulture) ?? string.Empty, text =>
    {
        if (text.Trim().Length == 0)
        {
            handoffOptions = handoffOptions with { SampleTime = null };
        }
        else if (double.TryParse(text.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var t) && t > 0 && double.IsFinite(t))
        {
            handoffOptions = handoffOptions with { SampleTime = t };
        }
        else
        {
            Say($"'{text}' is not a sample time: type seconds above 0, with a dot for decimals.");
            return false;
        }

        page.Refresh(HandoffText());
        return true;
    });

    private void AskHandoffFolder()
    {
        var baseDir = Session.Path is null ? Session.WorkingDirectory : Path.GetDirectoryName(Session.Path)!;
        AskText("write the package into folder: ", Path.Combine(baseDir, HandoffName() + "-handoff"), text =>
        {
            if (text.Trim().Length == 0)
            {
                Say("Type the folder to write the package into.");
                return false;
            }

            if (Session.Latest.Report is not { } report || handoffWriter is null)
            {
                Say("Nothing to write.");
                return true;
            }

            var options = handoffOptions with { Name = HandoffName() };
            var package = HandoffPackage.Build(report, options, Session.Case.Name);
            if (!package.IsSuccess)
            {
                Say($"Cannot hand off: {package.Problem}");
                return true;
            }

            var problem = handoffWriter(report, package.Value, options, text.Trim(), Session.Case.Name);
            Say(problem is null ? $"Wrote the hand-off package into {text.Trim()}. Read its caution before running hardware." : problem.ToString());
            return true;
        });
    }

    private void AskTarget()
    {
        var current = Session.CurrentTarget is { } t ? $"{TransferFunctionFormatter.Number(t.Real, 6)}, {TransferFunctionFormatter.Number(t.Imaginary, 6)}" : string.Empty;
        AskText("target s* (re, im | re ± im j | zeta=… wn=…): ", current, text =>
        {
            var (point, error) = TargetText.Parse(text);
            if (error is not null)
            {
                Say($"{error.Message} (column {error.Column}). {error.Hint}");
                return false;
            }

            Act(() => Session.SetTarget(point!.Value), reframe: true);
            return true;
        });
    }

    private void AskOpen()
    {
        void OpenPrompt(bool discard) => AskText("open case file: ", Session.Path ?? string.Empty, text =>
        {
            var path = text.Trim();
            if (path.Length == 0 || !File.Exists(path))
            {
                Say(path.Length == 0 ? "Type the path of a case file (TOML)." : $"Cannot open {path}: there is no such file.");
                return false;
            }

            var (c, error) = CaseFileReader.ReadFile(path);
            if (c is null)
            {
                Say($"Cannot open {path}: {error?.Message}");
                return false;
            }

            if (discard)
            {
                Session.DiscardAutosave();
            }

            OpenSession(new DesignSession(c, path, Session.WorkingDirectory));
            Say($"opened {Path.GetFileName(path)}");
            if (AutosaveFiles.NewerThanCase(Session.Path, Session.WorkingDirectory) is { } autosave)
            {
                OfferAutosave(autosave);
            }

            return true;
        });

        if (Session.IsDirty)
        {
            Ask("The case has unsaved changes. s save first · d discard them · Esc cancel", new Dictionary<Rune, Action>
            {
                [new Rune('s')] = () =>
                {
                    if (Save(then: () => OpenPrompt(discard: false)))
                    {
                        OpenPrompt(discard: false);
                    }
                },
                [new Rune('d')] = () => OpenPrompt(discard: true),
            });
            return;
        }

        OpenPrompt(discard: false);
    }

    /// <summary>Replaces the session (another case was opened): everything shown and chosen starts afresh.</summary>
    private void OpenSession(DesignSession next)
    {
        CancelSweep();
        CancelSearch();
        searched = null;
        sweepNote = null;
        Session = next;
        lastAutosavedRevision = -1;
        handoffOptions = new HandoffOptions();
        plane.Show(new SPlaneScene(), [], reframe: true);
        step.Show(null, 0);
        RefreshAll(reframe: true, refreshFields: true);
    }

    /// <summary>Saves; a new case asks for a path first (and then runs <paramref name="then"/>). True when saved now.</summary>
    private bool Save(Action? then)
    {
        if (Session.Path is null)
        {
            AskText("save as: ", Path.Combine(Session.WorkingDirectory, "case.toml"), text =>
            {
                var path = text.Trim();
                if (path.Length == 0)
                {
                    Say("Type a file name such as case.toml.");
                    return false;
                }

                if (File.Exists(path))
                {
                    Ask($"{Path.GetFileName(path)} exists. o overwrite it · Esc cancel", new Dictionary<Rune, Action>
                    {
                        [new Rune('o')] = () => SaveAs(path, then),
                    });
                    return true;
                }

                return SaveAs(path, then);
            });
            return false;
        }

        var failed = Session.Save();
        RefreshChrome();
        Say(failed?.ToString() ?? Session.Status);
        return failed is null;
    }

    private bool SaveAs(string path, Action? then)
    {
        var problem = Session.Save(path);
        RefreshChrome();
        Say(problem?.ToString() ?? Session.Status);
        if (problem is null)
        {
            then?.Invoke();
        }

        return problem is null;
    }

    private void RequestQuit()
    {
        if (!Session.IsDirty)
        {
            Quit();
            return;
        }

        Ask("Unsaved changes. s save and quit · d discard and quit · Esc stay", new Dictionary<Rune, Action>
        {
            [new Rune('s')] = () =>
            {
                if (Save(then: Quit))
                {
                    Quit();
                }
            },
            [new Rune('d')] = () =>
            {
                WorkDiscarded = true;
                Session.DiscardAutosave();
                Quit();
            },
        });
    }

    /// <summary>Set when the user chose to quit without saving: no autosave is kept.</summary>
    public bool WorkDiscarded { get; private set; }

    /// <summary>Set when the editor asked to stop (tests read it; the launcher's loop ends).</summary>
    public bool QuitRequested { get; private set; }

    private void Quit()
    {
        QuitRequested = true;
        CancelSweep();
        CancelSearch();
        App?.RequestStop();
    }

    private void Ask(string question, Dictionary<Rune, Action> choices, Action? onCancel = null)
    {
        prompt = new Prompt(question, choices, null, onCancel);
        message.Text = question;
        message.Visible = true;
        SetNeedsDraw();
    }

    private void AskText(string question, string initial, Func<string, bool> accept)
    {
        prompt = new Prompt(question, null, accept, null);
        message.Text = question;
        message.Visible = true;
        message.Width = question.Length;
        promptBox.X = question.Length;
        promptBox.Width = Dim.Fill();
        promptBox.Text = initial;
        promptBox.Visible = true;
        promptBox.SetFocus();
        promptBox.MoveEnd();
        SetNeedsLayout();
        SetNeedsDraw();
    }

    private bool HandlePromptKey(Key key)
    {
        var p = prompt!;
        if (key == Key.Esc)
        {
            EndPrompt();
            Say("cancelled");
            p.OnCancel?.Invoke();
            return true;
        }

        if (p.Accept is { } accept)
        {
            if (key == Key.Enter)
            {
                // The prompt ends first so that what it starts (another prompt, a page) can take over; when the
                // text is refused the same question is asked again with the text kept for correcting.
                var text = promptBox.Text ?? string.Empty;
                EndPrompt();
                if (!accept(text))
                {
                    var why = message.Text;
                    AskText(p.Question, text, accept);
                    SetText(hints, " " + why);
                }

                return true;
            }

            if (key == Key.Tab || key == Key.Tab.WithShift || key == Key.F6 || key == Key.F6.WithShift)
            {
                return true; // focus stays in the prompt until it is answered
            }

            return false; // the prompt's text box types it
        }

        if (key.AsRune is { Value: > 0 } rune && p.Choices!.TryGetValue(Rune.ToLowerInvariant(rune), out var choice))
        {
            EndPrompt();
            choice();
            return true;
        }

        return true; // other keys are swallowed while a question is open
    }

    private void EndPrompt()
    {
        prompt = null;
        promptBox.Visible = false;
        message.Width = Dim.Fill();
        message.Visible = true;
        if (page.Visible)
        {
            page.SetFocus();
        }
        else
        {
            plane.SetFocus();
        }

        RefreshChrome();
        SetNeedsLayout();
    }

    private bool HandlePageKey(Key key)
    {
        if (key == Key.Esc || key == Key.Q || key == Key.F1)
        {
            page.Close();
            plane.SetFocus();
            RefreshChrome();
            return true;
        }

        if (key == Key.CursorDown)
        {
            page.Scroll(1);
        }
        else if (key == Key.CursorUp)
        {
            page.Scroll(-1);
        }
        else if (key == Key.PageDown || key == Key.Space)
        {
            page.Scroll(page.Body);
        }
        else if (key == Key.PageUp)
        {
            page.Scroll(-page.Body);
        }
        else if (key == Key.Home)
        {
            page.Scroll(int.MinValue / 2);
        }
        else if (key == Key.End)
        {
            page.Scroll(int.MaxValue / 2);
        }
        else if (page.Kind == "handoff" && keys.FirstOrDefault(k => k.Scope == KeyScope.Handoff && k.Keys.Any(c => c == key)) is { } handoffKey)
        {
            handoffKey.Action(key);
        }
        else if (page.Kind == "search" && searched is { } outcome && TakeIndex(key) is { } index && index <= outcome.RunnersUp.Length)
        {
            var candidate = index == 0 ? outcome.Winner : outcome.RunnersUp[index - 1];
            page.Close();
            plane.SetFocus();
            Act(() => Session.TakeSearched(candidate.Choice, index == 0 ? "take the searched winner" : $"take searched runner-up {index}"), reframe: true, refreshFields: true);
        }
        else if (key == Key.Q.WithCtrl)
        {
            page.Close();
            RequestQuit();
        }

        return true;
    }

    private sealed record Prompt(string Question, Dictionary<Rune, Action>? Choices, Func<string, bool>? Accept, Action? OnCancel);
}
