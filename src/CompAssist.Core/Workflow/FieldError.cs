using CompAssist.Core.Parsing;

namespace CompAssist.Core.Workflow;

/// <summary>A parse error in one named input field (e.g. "plant").</summary>
/// <param name="Field">The field's name as the user knows it.</param>
/// <param name="Error">The positioned error inside the field's text.</param>
public sealed record FieldError(string Field, ParseError Error);
