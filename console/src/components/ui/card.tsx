interface CardProps extends React.HTMLAttributes<HTMLElement> {
  as?: 'section' | 'article' | 'div';
}

export function Card({ as: Tag = 'section', className = '', ...rest }: CardProps) {
  return <Tag className={`rounded-card border border-edge bg-panel p-5 ${className}`} {...rest} />;
}
