using CompAssist.Core.Editing;
using CompAssist.Core.Parsing;
using Terminal.Gui.Views;

namespace CompAssist.Tui.Views;

/// <summary>One edited case field: its label, its text box and the error it shows while the text is not accepted.</summary>
internal sealed class FieldBox
{
    public FieldBox(CaseField field, string label, int row, int labelX, int labelWidth, int boxWidth)
    {
        Field = field;
        Row = row;
        LabelX = labelX;
        BoxX = labelX + labelWidth;
        BaseLabel = label;
        Label = new Label { Text = label, X = labelX, Width = labelWidth };
        Box = new TextField { X = BoxX, Width = boxWidth };
    }

    public CaseField Field { get; }

    /// <summary>The form row (before error rows push it down).</summary>
    public int Row { get; }

    public int LabelX { get; }

    /// <summary>The label without the error marker.</summary>
    public string BaseLabel { get; }

    public int BoxX { get; }

    public Label Label { get; }

    public TextField Box { get; }

    /// <summary>Why the current text is not accepted, or null.</summary>
    public ParseError? Error { get; set; }
}
