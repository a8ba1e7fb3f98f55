// A modal question with its choices (renderer/state/questions.ts): the first primary choice has the focus, Escape picks
// the question's cancel choice. Nothing happens behind it until it is answered.
import { useEffect, useRef } from 'react';
import type { Question } from '../state/questions';
import './confirmDialog.css';

export interface ConfirmDialogProps {
  question: Question | undefined;
  onAnswer(choiceId: string): void;
}

export function ConfirmDialog({ question, onAnswer }: ConfirmDialogProps) {
  const primaryRef = useRef<HTMLButtonElement | null>(null);
  useEffect(() => {
    if (question === undefined) return;
    primaryRef.current?.focus();
    const onKey = (event: KeyboardEvent) => { if (event.key === 'Escape') { event.preventDefault(); onAnswer(question.cancelId); } };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [question, onAnswer]);
  if (question === undefined) return null;
  const primary = question.choices.find((choice) => choice.primary) ?? question.choices[0];
  return (
    <div className="confirm-backdrop" data-testid="confirm-dialog">
      <div className="confirm-box" role="alertdialog" aria-modal="true" aria-labelledby="confirm-title" aria-describedby="confirm-text">
        <h2 id="confirm-title">{question.title}</h2>
        <p id="confirm-text" data-testid="confirm-text">{question.text}</p>
        <div className="confirm-choices">
          {question.choices.map((choice) => (
            <button key={choice.id} type="button" ref={choice === primary ? primaryRef : undefined} className={choice.primary ? 'primary' : undefined} onClick={() => onAnswer(choice.id)} data-testid={`confirm-${choice.id}`}>{choice.label}</button>
          ))}
        </div>
      </div>
    </div>
  );
}
